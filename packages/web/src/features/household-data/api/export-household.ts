import { useMutation } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import { saveFile } from '../../../lib/save-file';

/** The owner's zip of the whole household: one JSON file per table, and the photos. */
export const exportHousehold = () => api.download('/export', 'workback-export.zip');

/** Fetches the zip and hands it to the browser as a download. */
export const useExportHousehold = () =>
  useMutation({
    mutationFn: async () => {
      const file = await exportHousehold();
      saveFile(file);
      return file;
    },
  });
