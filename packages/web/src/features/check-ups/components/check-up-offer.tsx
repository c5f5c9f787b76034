import { Link } from 'react-router-dom';

import { paths } from '../../../config/paths';
import { RIGHT_WORKING } from '../types';
import { MakeCheckUpButton } from './make-check-up-button';
import '../check-ups.css';

/** What a card knows of the latest check-up on its rules (the patterns API sends it). */
type LatestCheckUp = {
  id: number;
  status: 'not taken' | 'confirmed' | 'open';
  fits: string | null;
} | null;

/**
 * On a difficulty of a written method: the latest check-up on its rules and what it found, and
 * "Make a check-up" while the explanation is not settled (not a finding, or a check-up left it open).
 */
export function CheckUpOffer({
  studentId,
  ruleIds,
  settled,
  problems,
  latest,
  ruleName,
}: {
  studentId: number;
  ruleIds: readonly string[];
  /** Already a finding by the page's own definition. */
  settled: boolean;
  problems: readonly string[];
  latest: LatestCheckUp | undefined;
  ruleName: (id: string) => string;
}) {
  if (ruleIds.length === 0) return null;
  const offer = latest?.status !== 'not taken' && latest?.status !== 'confirmed' && !settled;
  return (
    <div className="wb-checkup-offer">
      {!latest ? null : (
        <p>
          <Link to={paths.app.checkUp.getHref(latest.id)}>
            {latest.status === 'not taken'
              ? 'A check-up is ready to give'
              : latest.status === 'confirmed'
                ? latest.fits === RIGHT_WORKING
                  ? 'Check-up: the answers fit the usual working'
                  : `Check-up: the answers fit ${ruleName(latest.fits ?? '')}`
                : 'Check-up: still open'}
          </Link>
        </p>
      )}
      {offer ? (
        <p className="wb-muted">
          Not settled yet: a few problems can tell the explanations apart.{' '}
          <MakeCheckUpButton studentId={studentId} ruleIds={ruleIds} problems={problems} small />
        </p>
      ) : null}
    </div>
  );
}
