import type { KeyItem } from '../types';

/** A key's items to read (tutors), with the API's checker flags. */
export function KeyItemsTable({ items }: { items: readonly KeyItem[] }) {
  if (items.length === 0) return <p className="wb-muted">This key has no items yet.</p>;
  return (
    <div className="wb-rtable-wrap">
      <table className="wb-rtable" aria-label="Items of the key">
        <thead>
          <tr>
            <th scope="col">No.</th>
            <th scope="col">Problem</th>
            <th scope="col">Answer</th>
            <th scope="col">Skills</th>
            <th scope="col">Lessons to revisit</th>
            <th scope="col">Fact family</th>
          </tr>
        </thead>
        <tbody>
          {items.map((item) => (
            <tr key={item.id}>
              <td data-label="No." className="wb-cell-strong">
                {item.number}
              </td>
              <td data-label="Problem" className="wb-digits">
                {item.prompt}
                {item.check.status === 'disagrees' || item.check.status === 'unreadable-answer' ? (
                  <span className="wb-flag wb-flag-block">{item.check.message}</span>
                ) : null}
              </td>
              <td data-label="Answer" className="wb-digits">
                {item.answer}
              </td>
              <td data-label="Skills">{item.skills.join(', ') || '—'}</td>
              <td data-label="Lessons to revisit">{item.revisit.join('; ') || '—'}</td>
              <td data-label="Fact family">{item.facts.join(', ') || '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
