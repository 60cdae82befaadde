import type { Keyholder } from '@server/keyholders/schema';
import { PhoneCall } from 'lucide-react';
import { useEffect, useRef, useState } from 'react';

import { AddInPlace } from '@/components/forms/add-in-place';
import { AlarmAttendanceSafetyCard } from '@/components/ui/alarm-attendance-safety-card';
import { Card } from '@/components/ui/card';
import { LiveMessage } from '@/components/ui/live-message';
import { Notice } from '@/components/ui/notice';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { useKeyholders } from '@/features/keyholders/api/get-keyholders';
import { useReorderKeyholders } from '@/features/keyholders/api/reorder-keyholders';
import { AddKeyholderForm } from '@/features/keyholders/components/add-keyholder-form';
import { KeyholderItem, type MoveDirection } from '@/features/keyholders/components/keyholder-item';
import { cn } from '@/utils/cn';

/** Who is looking at the call plan: office staff and homeowners may also invite keyholders. */
export type KeyholderViewer = 'engineer' | 'office' | 'homeowner';

const MINIMUM_KEYHOLDERS = 2;

type KeyholdersPanelProps = { siteId: string; viewer: KeyholderViewer };

function moved(ids: readonly string[], id: string, direction: MoveDirection): string[] {
  const from = ids.indexOf(id);
  const to = direction === 'up' ? from - 1 : from + 1;
  if (from < 0 || to < 0 || to >= ids.length) return [...ids];
  const next = [...ids];
  [next[from], next[to]] = [next[to]!, next[from]!];
  return next;
}

/** The site's call plan: who the monitoring centre rings, in order, when the alarm goes off. */
export function KeyholdersPanel({ siteId, viewer }: KeyholdersPanelProps) {
  const { data: keyholders } = useKeyholders(siteId);
  const reorder = useReorderKeyholders();
  const addButtonRef = useRef<HTMLButtonElement>(null);
  const [message, setMessage] = useState('');
  const moveButtons = useRef(new Map<string, HTMLButtonElement>());
  // React may move a list item's DOM node when the order changes, which drops focus; this says
  // where focus should land once the new order has rendered.
  const focusAfterMove = useRef<{ id: string; direction: MoveDirection } | null>(null);

  useEffect(() => {
    const target = focusAfterMove.current;
    if (target) {
      focusAfterMove.current = null;
      const other: MoveDirection = target.direction === 'up' ? 'down' : 'up';
      const same = moveButtons.current.get(`${target.id}:${target.direction}`);
      const fallback = moveButtons.current.get(`${target.id}:${other}`);
      (same && !same.disabled ? same : fallback)?.focus();
    }
  }, [keyholders]);

  const move = (keyholder: Keyholder, direction: MoveDirection) => {
    const keyholderIds = moved(
      keyholders.map((candidate) => candidate.id),
      keyholder.id,
      direction,
    );
    const newPosition = keyholderIds.indexOf(keyholder.id) + 1;
    focusAfterMove.current = { id: keyholder.id, direction };
    reorder.mutate({ siteId, keyholderIds });
    setMessage(`${keyholder.name} is now number ${newPosition} of ${keyholderIds.length}.`);
  };

  const canInvite = viewer === 'office' || viewer === 'homeowner';
  const isHomeowner = viewer === 'homeowner';

  return (
    <div
      className={cn(
        'grid gap-6',
        !isHomeowner && 'xl:grid-cols-[minmax(0,1fr)_20rem] xl:items-start',
      )}
    >
      <Card title="Call plan" icon={PhoneCall} flush>
        <div className="grid gap-4 border-b border-hairline px-4 py-4 md:px-5">
          <p>
            When the alarm goes off, the monitoring centre rings these people in order, number 1
            first, until someone can attend.
          </p>
          {keyholders.length < MINIMUM_KEYHOLDERS ? (
            <Notice tone="fault" title="Fewer than two keyholders">
              {keyholders.length === 0
                ? 'Nobody is on the call plan yet. '
                : 'With only one keyholder, nobody can be called when they are away or do not answer. '}
              Add at least two people who live or work close by.
            </Notice>
          ) : null}
          {reorder.isError ? <ProblemAlert error={reorder.error} /> : null}
        </div>

        {keyholders.length > 0 ? (
          <ol aria-label="Call order" className="divide-y divide-hairline">
            {keyholders.map((keyholder, index) => (
              <KeyholderItem
                key={keyholder.id}
                siteId={siteId}
                keyholder={keyholder}
                position={index + 1}
                total={keyholders.length}
                canInvite={canInvite}
                onMove={move}
                moveButtonRef={(direction, element) => {
                  const key = `${keyholder.id}:${direction}`;
                  if (element) moveButtons.current.set(key, element);
                  else moveButtons.current.delete(key);
                }}
                announce={setMessage}
                onRemoved={(removed) => {
                  setMessage(`${removed.name} was removed from the call plan.`);
                  addButtonRef.current?.focus();
                }}
              />
            ))}
          </ol>
        ) : null}

        <AddInPlace addLabel="Add keyholder" formTitle="New keyholder" addButtonRef={addButtonRef}>
          {({ headingId, close }) => (
            <AddKeyholderForm
              siteId={siteId}
              headingId={headingId}
              onAdded={(added) => {
                setMessage(`${added.name} added to the call plan as number ${added.callOrder}.`);
                close();
              }}
              onCancel={close}
            />
          )}
        </AddInPlace>
        <LiveMessage message={message} />
      </Card>

      <AlarmAttendanceSafetyCard />
    </div>
  );
}
