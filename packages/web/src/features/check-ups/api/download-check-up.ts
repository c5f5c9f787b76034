import { useMutation } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import { saveFile } from '../../../lib/save-file';

export type CheckUpSheet = 'sheet' | 'answers';

/** The child's sheet (problems only) or the parent's page of answers, as a PDF. */
export const downloadCheckUp = ({ id, which }: { id: number; which: CheckUpSheet }) =>
  api.download(`/check-ups/${id}/${which}.pdf`, `check-up-${id}-${which}.pdf`);

export const useDownloadCheckUp = () =>
  useMutation({
    mutationFn: async (input: { id: number; which: CheckUpSheet }) => {
      const file = await downloadCheckUp(input);
      saveFile(file);
      return file;
    },
  });
