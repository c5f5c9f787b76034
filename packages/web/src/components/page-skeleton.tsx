import './page-skeleton.css';

/**
 * The outline of a page while the app starts (its scripts, the sign-in check, the first page's
 * code). index.html holds the same markup, shown before any script runs; keep the two alike.
 */
export function PageSkeleton() {
  return (
    <div className="wb-skeleton" role="status" aria-label="Opening Workback…">
      <div className="wb-skeleton-side" />
      <div className="wb-skeleton-main">
        <div className="wb-skeleton-title" />
        <div className="wb-skeleton-row" />
        <div className="wb-skeleton-row" />
        <div className="wb-skeleton-row" />
        <div className="wb-skeleton-row" />
      </div>
    </div>
  );
}
