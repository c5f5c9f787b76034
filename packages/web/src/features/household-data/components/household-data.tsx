import { Card } from '@blueprintjs/core';

import type { DeletionSummary } from '../api/delete-household';
import { DeleteHousehold } from './delete-household';
import { ExportData } from './export-data';

import '../household-data.css';

/** The owner's part of the Account page: take everything out, or delete everything. */
export function HouseholdData({
  householdName,
  onDeleted,
}: {
  householdName: string;
  onDeleted: (summary: DeletionSummary) => void;
}) {
  return (
    <Card className="wb-account wb-household-data">
      <h2 className="wb-data-heading">Your family’s data</h2>
      <p className="wb-muted">
        As the owner you can take everything out of Workback, or delete it, at any time.
      </p>
      <ExportData />
      <DeleteHousehold householdName={householdName} onDeleted={onDeleted} />
    </Card>
  );
}
