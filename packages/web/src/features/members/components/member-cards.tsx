import { Button, Card, Tag } from '@blueprintjs/core';
import { BlockedPersonIcon, EditIcon } from '@blueprintjs/icons';
import { Role } from '@workback/core';

import { ROLE_LABEL } from '../../../lib/auth';
import { formatDay, studentNames, type Member, type StudentRef } from '../types';

type MemberCardsProps = {
  members: readonly Member[];
  students: readonly StudentRef[];
  viewerIsOwner: boolean;
  onChange: (member: Member) => void;
  onRemove: (member: Member) => void;
};

function WhatTheySee({ member, students }: { member: Member; students: readonly StudentRef[] }) {
  if (member.role !== Role.tutor) return <>Sees every child</>;
  return <>Sees {studentNames(member.studentIds ?? [], students)}</>;
}

/** Everyone in the household as cards: they read the same at 390 px and at 1280 px. */
export function MemberCards({
  members,
  students,
  viewerIsOwner,
  onChange,
  onRemove,
}: MemberCardsProps) {
  return (
    <ul className="wb-cards wb-member-cards" aria-label="Members">
      {members.map((member) => {
        const ownerOutOfReach = member.role === Role.owner && !viewerIsOwner;
        return (
          <li key={member.id}>
            <Card className="wb-card wb-member-card">
              <div className="wb-card-main">
                <span className="wb-card-title">
                  {member.displayName}
                  {member.isYou ? <span className="wb-muted wb-member-you"> (you)</span> : null}
                </span>
                <span className="wb-member-email">{member.email}</span>
                <span className="wb-member-meta">
                  <Tag minimal round className={`wb-role-tag wb-role-${member.role}`}>
                    {ROLE_LABEL[member.role]}
                  </Tag>
                  <span className="wb-muted">
                    <WhatTheySee member={member} students={students} /> · joined{' '}
                    {formatDay(member.joinedAt)}
                  </span>
                </span>
              </div>
              {member.isYou ? null : ownerOutOfReach ? (
                <span className="wb-muted wb-member-note">Only an owner can change an owner.</span>
              ) : (
                <span className="wb-row-actions">
                  <Button
                    size="small"
                    variant="minimal"
                    icon={<EditIcon />}
                    onClick={() => onChange(member)}
                    aria-label={`Change access for ${member.displayName}`}
                  >
                    Change access
                  </Button>
                  <Button
                    size="small"
                    variant="minimal"
                    icon={<BlockedPersonIcon />}
                    onClick={() => onRemove(member)}
                    aria-label={`Remove ${member.displayName}`}
                  >
                    Remove
                  </Button>
                </span>
              )}
            </Card>
          </li>
        );
      })}
    </ul>
  );
}
