import { LockIcon } from '@blueprintjs/icons';

/**
 * What we promise about children's data, said before anyone signs up. A tutor invited by a
 * family reads it as a tutor: the children are the family's, and only the family's owner
 * exports or deletes their data.
 */
export function PrivacyCaution({ audience = 'parent' }: { audience?: 'parent' | 'tutor' }) {
  if (audience === 'tutor') {
    return (
      <section className="wb-caution" aria-labelledby="privacy-title">
        <h2 id="privacy-title" className="wb-caution-title">
          <LockIcon aria-hidden /> About the children’s data you will see
        </h2>
        <ul>
          <li>
            You see only the children the family chose to share with you: a first name or nickname,
            a grade, and their work.
          </li>
          <li>The family’s owner can export or delete this data at any time; tutors cannot.</li>
          <li>Location and camera details are removed from every photo.</li>
          <li>
            The step checkers help the family’s judgement and yours. They do not grade or assess a
            child.
          </li>
        </ul>
      </section>
    );
  }
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
