import { Button } from '@blueprintjs/core';

import { useHealth } from '../api/get-health';

export const DEMO_PASSWORD = 'workback-demo';

const DEMO_ACCOUNTS = [
  { email: 'parent@workback.test', who: 'Parent who set up the household (owner)' },
  { email: 'coparent@workback.test', who: 'Second parent' },
  { email: 'tutor@workback.test', who: 'Tutor, sees one of the two children' },
  { email: 'admin@workback.test', who: 'Site admin, sees no children’s data' },
] as const;

/** Shown only when the server runs with the invented demo household loaded. */
export function DemoSignIns({ onPick }: { onPick: (email: string, password: string) => void }) {
  const health = useHealth();
  if (!health.data?.demo) return null;
  return (
    <section className="wb-demo" aria-labelledby="demo-title">
      <h2 id="demo-title" className="wb-demo-title">
        Try the demo household
      </h2>
      <p className="wb-muted">
        Every demo account uses the password <code>{DEMO_PASSWORD}</code>. Pick one to fill in the
        form.
      </p>
      <ul className="wb-demo-list">
        {DEMO_ACCOUNTS.map((account) => (
          <li key={account.email}>
            <Button
              variant="minimal"
              alignText="start"
              fill
              onClick={() => onPick(account.email, DEMO_PASSWORD)}
            >
              <span className="wb-demo-email">{account.email}</span>
              <span className="wb-demo-who">{account.who}</span>
            </Button>
          </li>
        ))}
      </ul>
    </section>
  );
}
