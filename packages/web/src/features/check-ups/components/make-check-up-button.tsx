import { Button } from '@blueprintjs/core';
import { ClipboardIcon } from '@blueprintjs/icons';
import { useNavigate } from 'react-router-dom';

import { useToast } from '../../../components/toaster';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { useCreateCheckUp } from '../api/create-check-up';

/** Digits of the largest number in the problems, so a check-up matches the child's level. */
export function digitsOf(problems: readonly string[]): number | undefined {
  const lengths = problems.flatMap((p) =>
    (p.replace(/,/g, '').match(/\d+/g) ?? []).map((n) => n.length),
  );
  return lengths.length ? Math.min(6, Math.max(...lengths)) : undefined;
}

/**
 * "Make a check-up": plans a few problems that tell the open explanations apart, then opens
 * the check-up page with its sheets to print.
 */
export function MakeCheckUpButton({
  studentId,
  ruleIds,
  problems = [],
  small = false,
}: {
  studentId: number;
  ruleIds: readonly string[];
  /** The problems of the misses in question, for the size of the numbers. */
  problems?: readonly string[];
  small?: boolean;
}) {
  const create = useCreateCheckUp();
  const navigate = useNavigate();
  const toast = useToast();
  const make = async () => {
    try {
      const digits = digitsOf(problems);
      const checkUp = await create.mutateAsync({
        studentId,
        ruleIds: [...ruleIds],
        ...(digits === undefined ? {} : { digits }),
      });
      void navigate(paths.app.checkUp.getHref(checkUp.id));
    } catch (error) {
      toast(
        isApiError(error) && error.fields?.ruleIds
          ? error.fields.ruleIds
          : 'The check-up could not be made. Please try again.',
        'danger',
      );
    }
  };
  return (
    <Button
      icon={<ClipboardIcon />}
      size={small ? 'small' : 'medium'}
      variant="outlined"
      loading={create.isPending}
      onClick={() => void make()}
    >
      Make a check-up
    </Button>
  );
}
