import { HTMLSelect, Intent } from '@blueprintjs/core';
import { useNavigate } from 'react-router-dom';

import { paths } from '../../config/paths';
import { isApiError } from '../../lib/api-client';
import { ROLE_LABEL, type Me } from '../../lib/auth';
import { useSwitchHousehold } from '../../lib/households';
import { useToast } from '../toaster';

import './household-switcher.css';

/**
 * For someone in several households (a tutor working with three families): which one the app is
 * showing, and a choice of the others. Switching starts again on the Students page.
 */
export function HouseholdSwitcher({ me, place }: { me: Me; place: 'sidebar' | 'topbar' }) {
  const switchHousehold = useSwitchHousehold();
  const navigate = useNavigate();
  const toast = useToast();
  const id = `household-switch-${place}`;
  const current = me.household?.id;
  return (
    <div className={`wb-switcher wb-switcher-${place}`}>
      <label htmlFor={id} className={place === 'sidebar' ? 'wb-household-label' : 'wb-sr-label'}>
        Household
      </label>
      <HTMLSelect
        id={id}
        value={current === undefined ? '' : String(current)}
        disabled={switchHousehold.isPending}
        fill
        onChange={(event) => {
          const householdId = Number(event.currentTarget.value);
          const target = me.households.find((h) => h.id === householdId);
          if (!target || householdId === current) return;
          switchHousehold.mutate(householdId, {
            onSuccess: () => {
              toast(`Now showing ${target.name}.`);
              void navigate(paths.app.students.getHref());
            },
            onError: (error) =>
              toast(
                isApiError(error)
                  ? `Could not switch: ${error.message}`
                  : 'Could not switch household. Please try again.',
                Intent.WARNING,
              ),
          });
        }}
        options={me.households.map((h) => ({
          value: String(h.id),
          label: `${h.name} · ${ROLE_LABEL[h.role]}`,
        }))}
      />
    </div>
  );
}
