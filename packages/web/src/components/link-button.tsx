import { Classes } from '@blueprintjs/core';
import type { JSX, ReactNode } from 'react';
import { Link } from 'react-router-dom';

/** A router link drawn as a Blueprint button (navigation stays in the app, no page reload). */
export function LinkButton({
  to,
  icon,
  primary = false,
  outlined = false,
  className,
  children,
}: {
  to: string;
  icon?: JSX.Element;
  primary?: boolean;
  outlined?: boolean;
  className?: string;
  children: ReactNode;
}) {
  const classes = [
    Classes.BUTTON,
    primary ? Classes.INTENT_PRIMARY : null,
    outlined ? Classes.OUTLINED : null,
    'wb-button-link',
    className,
  ]
    .filter(Boolean)
    .join(' ');
  return (
    <Link className={classes} to={to}>
      {icon}
      <span className={Classes.BUTTON_TEXT}>{children}</span>
    </Link>
  );
}
