import { Button, Intent } from '@blueprintjs/core';
import { DownloadIcon } from '@blueprintjs/icons';

import { useToast } from '../../../components/toaster';
import { isApiError } from '../../../lib/api-client';
import { useExportHousehold } from '../api/export-household';

/** "Export everything": the whole household as a zip the owner keeps. */
export function ExportData() {
  const exportZip = useExportHousehold();
  const toast = useToast();
  return (
    <section className="wb-data-section" aria-labelledby="data-export">
      <h3 id="data-export" className="wb-data-title">
        Export everything
      </h3>
      <p>
        A zip of the whole household: every student, miss, note, sitting, answer key and plan as
        JSON files, one per kind, with the photos. Passwords and links are never in it.
      </p>
      <p className="wb-muted">It holds your children’s work: keep it somewhere private.</p>
      <Button
        icon={<DownloadIcon />}
        intent={Intent.PRIMARY}
        variant="outlined"
        loading={exportZip.isPending}
        onClick={() =>
          exportZip.mutate(undefined, {
            onSuccess: (file) => toast(`Your export is downloading: ${file.filename}.`),
            onError: (error) =>
              toast(
                isApiError(error)
                  ? `The export did not work: ${error.message}`
                  : 'The export did not work. Please try again.',
                Intent.WARNING,
              ),
          })
        }
      >
        Download the export (zip)
      </Button>
    </section>
  );
}
