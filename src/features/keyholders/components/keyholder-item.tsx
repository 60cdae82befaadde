import { KEYHOLDER_TARGET_MINUTES, type Keyholder } from '@server/keyholders/schema';
import {
  ArrowDown,
  ArrowUp,
  CalendarX2,
  CircleCheck,
  CircleDashed,
  Mail,
  Pencil,
  TriangleAlert,
} from 'lucide-react';
import { useRef, useState } from 'react';

import { InPlaceFormSection } from '@/components/forms/in-place-form-section';
import { Button } from '@/components/ui/button';
import { ConfirmButton } from '@/components/ui/confirm-button';
import { DetailItem } from '@/components/ui/detail-item';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { TelLink } from '@/components/ui/tel-link';
import { useConfirmKeyholder } from '@/features/keyholders/api/confirm-keyholder';
import { useDeleteKeyholder } from '@/features/keyholders/api/delete-keyholder';
import { useInviteKeyholder } from '@/features/keyholders/api/invite-keyholder';
import { EditKeyholderForm } from '@/features/keyholders/components/edit-keyholder-form';
import { formatCalendarDate, todayAsCalendarDate } from '@/lib/dates';
import { useInPlaceForm } from '@/lib/use-in-place-form';
import { formatDateTime } from '@/utils/format';

export type MoveDirection = 'up' | 'down';

type KeyholderItemProps = {
  siteId: string;
  keyholder: Keyholder;
  position: number;
  total: number;
  canInvite: boolean;
  onMove: (keyholder: Keyholder, direction: MoveDirection) => void;
  moveButtonRef: (direction: MoveDirection, element: HTMLButtonElement | null) => void;
  announce: (message: string) => void;
  onRemoved: (keyholder: Keyholder) => void;
};

function AttendTime({ minutes }: { minutes: number }) {
  const isOverTarget = minutes > KEYHOLDER_TARGET_MINUTES;
  return (
    <span className="inline-flex flex-wrap items-center gap-x-2">
      <span className="font-mono">{minutes} min</span>
      {isOverTarget ? (
        <span className="inline-flex items-center gap-1 font-semibold text-fault-text">
          <TriangleAlert aria-hidden="true" className="size-4 shrink-0" />
          Over the {KEYHOLDER_TARGET_MINUTES}-minute target
        </span>
      ) : null}
    </span>
  );
}

function UnavailableDates({ ranges }: { ranges: Keyholder['unavailable'] }) {
  if (ranges.length === 0) return <>None given</>;
  const today = todayAsCalendarDate();
  return (
    <ul className="grid gap-1">
      {ranges.map((range) => {
        const isAwayToday = range.from <= today && today <= range.to;
        return (
          <li key={`${range.from}-${range.to}-${range.note}`}>
            {formatCalendarDate(range.from)} to {formatCalendarDate(range.to)}
            {range.note ? ` (${range.note})` : null}
            {isAwayToday ? (
              <span className="ml-2 inline-flex items-center gap-1 font-semibold text-fault-text">
                <CalendarX2 aria-hidden="true" className="size-4 shrink-0" />
                Away today
              </span>
            ) : null}
          </li>
        );
      })}
    </ul>
  );
}

/** One person in the call plan; their list item's text starts with their place, "1. Name". */
export function KeyholderItem({
  siteId,
  keyholder,
  position,
  total,
  canInvite,
  onMove,
  moveButtonRef,
  announce,
  onRemoved,
}: KeyholderItemProps) {
  const editButtonRef = useRef<HTMLButtonElement>(null);
  const { isOpen: isEditing, open: openEditor, close: closeEditor } = useInPlaceForm(editButtonRef);
  const [invitationSent, setInvitationSent] = useState(false);
  const { name } = keyholder;

  const confirmKeyholder = useConfirmKeyholder({
    mutationConfig: { onSuccess: () => announce(`Details checked for ${name}.`) },
  });
  const inviteKeyholder = useInviteKeyholder({
    mutationConfig: {
      onSuccess: () => {
        setInvitationSent(true);
        announce(`Invitation e-mailed to ${name}.`);
      },
    },
  });
  const deleteKeyholder = useDeleteKeyholder({
    mutationConfig: { onSuccess: () => onRemoved(keyholder) },
  });
  const failedAction = [confirmKeyholder, inviteKeyholder, deleteKeyholder].find(
    (mutation) => mutation.isError,
  );

  return (
    <li className="grid gap-4 px-4 py-5 md:px-5">
      <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <h3 className="text-lg font-semibold">
          <span className="font-mono">{position}.</span> {name}
        </h3>
        {keyholder.relation ? <span className="text-ink-muted">{keyholder.relation}</span> : null}
      </div>

      {isEditing ? (
        <InPlaceFormSection title={`Change ${name}'s details`} headingLevel={4}>
          {(headingId) => (
            <EditKeyholderForm
              siteId={siteId}
              keyholder={keyholder}
              headingId={headingId}
              onSaved={(saved) => {
                closeEditor();
                announce(`Saved ${saved.name}'s details.`);
              }}
              onCancel={closeEditor}
            />
          )}
        </InPlaceFormSection>
      ) : (
        <dl className="grid gap-x-6 gap-y-3 sm:grid-cols-2 lg:grid-cols-3">
          <DetailItem term="Mobile phone">
            <TelLink phone={keyholder.phone} accessiblePrefix={`Call ${name} on`} />
          </DetailItem>
          <DetailItem term="E-mail">{keyholder.email ?? 'None given'}</DetailItem>
          <DetailItem term="Minutes to reach the site">
            <AttendTime minutes={keyholder.minutesToAttend} />
          </DetailItem>
          <DetailItem term="Dates away">
            <UnavailableDates ranges={keyholder.unavailable} />
          </DetailItem>
          <DetailItem term="Details last checked">
            {keyholder.lastConfirmedAt ? (
              <time dateTime={keyholder.lastConfirmedAt}>
                {formatDateTime(keyholder.lastConfirmedAt)}
              </time>
            ) : (
              'Never'
            )}
          </DetailItem>
          <DetailItem term="Wardbook account">
            {keyholder.hasAccount ? (
              <span className="inline-flex items-center gap-1.5">
                <CircleCheck aria-hidden="true" className="size-4 shrink-0 text-normal" />
                Has a Wardbook account
              </span>
            ) : (
              <span className="inline-flex items-center gap-1.5">
                <CircleDashed aria-hidden="true" className="size-4 shrink-0 text-info" />
                {invitationSent ? 'Invitation sent' : 'No account yet'}
              </span>
            )}
          </DetailItem>
        </dl>
      )}

      {failedAction ? <ProblemAlert error={failedAction.error} /> : null}

      {isEditing ? null : (
        <div className="flex flex-wrap gap-2">
          <Button
            ref={(element) => moveButtonRef('up', element)}
            variant="secondary"
            size="lg"
            disabled={position === 1}
            onClick={() => onMove(keyholder, 'up')}
          >
            <ArrowUp aria-hidden="true" className="size-5" />
            Move <span className="sr-only">{name}</span> up
          </Button>
          <Button
            ref={(element) => moveButtonRef('down', element)}
            variant="secondary"
            size="lg"
            disabled={position === total}
            onClick={() => onMove(keyholder, 'down')}
          >
            <ArrowDown aria-hidden="true" className="size-5" />
            Move <span className="sr-only">{name}</span> down
          </Button>
          <Button ref={editButtonRef} variant="secondary" size="lg" onClick={openEditor}>
            <Pencil aria-hidden="true" className="size-5" />
            Edit <span className="sr-only">{name}</span>
          </Button>
          <Button
            variant="secondary"
            size="lg"
            aria-disabled={confirmKeyholder.isPending}
            onClick={() => {
              if (!confirmKeyholder.isPending) {
                confirmKeyholder.mutate({ siteId, keyholderId: keyholder.id });
              }
            }}
          >
            <CircleCheck aria-hidden="true" className="size-5" />
            Details checked <span className="sr-only">for {name}</span>
          </Button>
          {canInvite && !keyholder.hasAccount && keyholder.email ? (
            <Button
              variant="secondary"
              size="lg"
              aria-disabled={inviteKeyholder.isPending}
              onClick={() => {
                if (!inviteKeyholder.isPending) {
                  inviteKeyholder.mutate({ siteId, keyholderId: keyholder.id });
                }
              }}
            >
              <Mail aria-hidden="true" className="size-5" />
              {invitationSent ? 'Invite again' : 'Invite to Wardbook'}
              <span className="sr-only">: {name}</span>
            </Button>
          ) : null}
          <ConfirmButton
            size="lg"
            question={`Remove ${name} from the call plan? Everyone after them moves up one place.`}
            confirmLabel={`Yes, remove ${name}`}
            cancelLabel="Keep them"
            pending={deleteKeyholder.isPending}
            onConfirm={() => deleteKeyholder.mutate({ siteId, keyholderId: keyholder.id })}
          >
            Remove <span className="sr-only">{name}</span>
          </ConfirmButton>
        </div>
      )}
      {canInvite && !keyholder.hasAccount && !keyholder.email && !isEditing ? (
        <p className="text-sm text-ink-muted">
          Add an e-mail address to invite {name} to Wardbook, where they can see the access notes
          and their place in the call order.
        </p>
      ) : null}
    </li>
  );
}
