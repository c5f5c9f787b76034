import { LockIcon } from '@blueprintjs/icons';

/** What we promise about children's data, said before anyone signs up. */
export function PrivacyCaution() {
  return (
    <section className="wb-caution" aria-labelledby="privacy-title">
      <h2 id="privacy-title" className="wb-caution-title">
        <LockIcon aria-hidden /> About your children’s data
      </h2>
      <ul>
        <li>
          We ask for the least: a first name or nickname and a grade for each child. No last names,
          birthdays or schools.
        </li>
        <li>As the owner you can export everything, or delete it, at any time.</li>
        <li>Location and camera details are removed from every photo you upload.</li>
        <li>One household never sees another household’s data.</li>
        <li>
          Check your local rules on children’s privacy and on homeschool records. Workback does not
          claim to meet any law or record-keeping requirement for you.
        </li>
        <li>
          The step checkers help your judgement as a parent. They do not grade or assess your child.
        </li>
      </ul>
    </section>
  );
}
