import { Button, PopoverNext } from '@blueprintjs/core';
import {
  BookIcon,
  CameraIcon,
  ClipboardIcon,
  DocumentIcon,
  HeatGridIcon,
  IdNumberIcon,
  LogOutIcon,
  ManualIcon,
  MoreIcon,
  PeopleIcon,
  TimelineEventsIcon,
  UserIcon,
} from '@blueprintjs/icons';
import { useState, type ReactNode } from 'react';
import { NavLink, useNavigate } from 'react-router-dom';

import { paths } from '../../config/paths';
import { canEditHousehold, roleLabel, useSignOut, useSignedIn, type Me } from '../../lib/auth';
import { Brand } from '../brand';
import { useToast } from '../toaster';
import { HouseholdSwitcher } from './household-switcher';

export type NavItem = {
  to: string;
  label: string;
  icon: ReactNode;
  /** The main action: drawn larger, in the accent, first on the phone bar. */
  primary?: boolean;
  /** Shown only to whom it is for (e.g. owners and parents log misses). */
  shownTo?: (me: Me) => boolean;
};

const seesChildren = (me: Me) => !me.user.isAdmin && me.household !== null;

// Later pages slot in here in reading order; the phone bar leads with "Log a miss".
export const NAV_ITEMS: readonly NavItem[] = [
  {
    to: paths.app.logMiss.getHref(),
    label: 'Log a miss',
    icon: <CameraIcon />,
    primary: true,
    shownTo: canEditHousehold,
  },
  {
    to: paths.app.notebook.getHref(),
    label: 'Notebook',
    icon: <ManualIcon />,
    shownTo: seesChildren,
  },
  {
    to: paths.app.sittings.getHref(),
    label: 'Sittings',
    icon: <TimelineEventsIcon />,
    shownTo: seesChildren,
  },
  { to: paths.app.students.getHref(), label: 'Students', icon: <PeopleIcon /> },
  {
    to: paths.app.answerKeys.getHref(),
    label: 'Answer keys',
    icon: <DocumentIcon />,
    shownTo: seesChildren,
  },
  {
    to: paths.app.curriculum.getHref(),
    label: 'Curriculum',
    icon: <BookIcon />,
    shownTo: seesChildren,
  },
  {
    to: paths.app.patterns.getHref(),
    label: 'Patterns',
    icon: <HeatGridIcon />,
    shownTo: seesChildren,
  },
  {
    to: paths.app.reviewPlans.getHref(),
    label: 'Review plans',
    icon: <ClipboardIcon />,
    shownTo: seesChildren,
  },
  {
    to: paths.app.members.getHref(),
    label: 'Members',
    icon: <IdNumberIcon />,
    shownTo: canEditHousehold,
  },
  { to: paths.app.account.getHref(), label: 'Account', icon: <UserIcon /> },
];

/**
 * The phone bar's four slots, by role: a parent logs, reads the notebook, watches patterns and
 * plans reviews; a tutor starts from patterns. The rest sit behind “More”.
 */
const PHONE_SLOTS_FAMILY = [
  paths.app.logMiss.getHref(),
  paths.app.notebook.getHref(),
  paths.app.patterns.getHref(),
  paths.app.reviewPlans.getHref(),
];
const PHONE_SLOTS_HELPER = [
  paths.app.patterns.getHref(),
  paths.app.notebook.getHref(),
  paths.app.reviewPlans.getHref(),
  paths.app.students.getHref(),
];

/** The pages this member may open, in reading order. */
export function visibleNavItems(me: Me): NavItem[] {
  return NAV_ITEMS.filter((item) => !item.shownTo || item.shownTo(me));
}

/** The items on the phone bar itself (in slot order) and those behind “More”. */
export function phoneNav(me: Me, items: readonly NavItem[]) {
  const slots = canEditHousehold(me) ? PHONE_SLOTS_FAMILY : PHONE_SLOTS_HELPER;
  const bar = slots.flatMap((to) => items.filter((item) => item.to === to));
  return { bar, more: items.filter((item) => !bar.includes(item)) };
}

/** The phone bar's last button: the less frequent pages in a small menu above the bar. */
function PhoneMore({ items }: { items: readonly NavItem[] }) {
  const [open, setOpen] = useState(false);
  return (
    <PopoverNext
      isOpen={open}
      onInteraction={setOpen}
      usePortal={false}
      placement="top-end"
      arrow={false}
      className="wb-bottombar-more"
      content={
        <ul className="wb-more-menu">
          {items.map((item) => (
            <li key={item.to}>
              <NavLink to={item.to} className="wb-more-link" onClick={() => setOpen(false)}>
                {item.icon}
                <span>{item.label}</span>
              </NavLink>
            </li>
          ))}
        </ul>
      }
    >
      <button type="button" className="wb-bottombar-link" aria-expanded={open}>
        <MoreIcon />
        <span>More</span>
      </button>
    </PopoverNext>
  );
}

export function SignOutButton({ className }: { className?: string }) {
  const signOut = useSignOut();
  const navigate = useNavigate();
  const toast = useToast();
  return (
    <Button
      className={className}
      icon={<LogOutIcon />}
      variant="minimal"
      loading={signOut.isPending}
      onClick={() =>
        signOut.mutate(undefined, {
          onSettled: () => {
            toast('You are signed out.');
            void navigate(paths.signIn.getHref(), { replace: true });
          },
        })
      }
    >
      Sign out
    </Button>
  );
}

/** The signed-in frame: side navigation on wide screens, a bottom bar on phones. */
export function AppShell({ children }: { children: ReactNode }) {
  const me = useSignedIn();
  const householdName = me.household?.name ?? roleLabel(me);
  const items = visibleNavItems(me);
  const phone = phoneNav(me, items);
  return (
    <div className="wb-shell">
      <a className="wb-skip" href="#main">
        Skip to the page
      </a>
      <aside className="wb-sidebar" aria-label="Workback">
        <Brand />
        {me.households.length > 1 ? (
          <HouseholdSwitcher me={me} place="sidebar" />
        ) : (
          <div className="wb-household">
            <span className="wb-household-label">Household</span>
            <span className="wb-household-name">{householdName}</span>
          </div>
        )}
        <nav aria-label="Main">
          <ul className="wb-nav">
            {items.map((item) => (
              <li key={item.to}>
                <NavLink
                  to={item.to}
                  className={item.primary ? 'wb-nav-link wb-nav-primary' : 'wb-nav-link'}
                >
                  {item.icon}
                  <span>{item.label}</span>
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
        <div className="wb-person">
          <span className="wb-person-name">{me.user.displayName}</span>
          <span className="wb-person-role">{roleLabel(me)}</span>
          <SignOutButton className="wb-person-signout" />
        </div>
      </aside>
      <header className="wb-topbar">
        <Brand />
        {me.households.length > 1 ? (
          <HouseholdSwitcher me={me} place="topbar" />
        ) : (
          <span className="wb-topbar-household">{householdName}</span>
        )}
      </header>
      <main className="wb-main" id="main" tabIndex={-1}>
        {children}
      </main>
      <nav className="wb-bottombar" aria-label="Main (phone)">
        {phone.bar.map((item) => (
          <NavLink
            key={item.to}
            to={item.to}
            className={
              item.primary ? 'wb-bottombar-link wb-bottombar-primary' : 'wb-bottombar-link'
            }
          >
            {item.icon}
            <span>{item.label}</span>
          </NavLink>
        ))}
        {phone.more.length > 0 ? <PhoneMore items={phone.more} /> : null}
      </nav>
    </div>
  );
}
