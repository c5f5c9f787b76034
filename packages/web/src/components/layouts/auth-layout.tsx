import type { ReactNode } from 'react';

import { Brand } from '../brand';

/** Sign-in and sign-up: one sheet of paper in the middle of the table. */
export function AuthLayout({
  title,
  intro,
  children,
  aside,
}: {
  title: string;
  intro?: ReactNode;
  children: ReactNode;
  aside?: ReactNode;
}) {
  return (
    <div className="wb-auth">
      <header className="wb-auth-header">
        <Brand />
        <p className="wb-tagline">
          A notebook for the math problems a child missed, and what to review next.
        </p>
      </header>
      <main className="wb-auth-main" id="main">
        <section className="wb-sheet" aria-labelledby="page-title">
          <h1 id="page-title" className="wb-page-title">
            {title}
          </h1>
          {intro ? <div className="wb-auth-intro">{intro}</div> : null}
          {children}
        </section>
        {aside}
      </main>
    </div>
  );
}
