/** The word mark: a small ruled-paper square and the name. */
export function Brand({ as: Tag = 'span' }: { as?: 'span' | 'h1' }) {
  return (
    <Tag className="wb-brand">
      <span className="wb-brand-mark" aria-hidden="true" />
      <span className="wb-brand-name">Workback</span>
    </Tag>
  );
}
