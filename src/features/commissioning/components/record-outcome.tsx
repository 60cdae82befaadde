import { Smartphone } from 'lucide-react';

import { Notice } from '@/components/ui/notice';
import type { OutboxEntry } from '@/features/commissioning/utils/outbox';

/** Said when a record could not be sent and is waiting in the phone's outbox. */
export const KEPT_ON_PHONE = 'Saved on this phone — will send when back online';

type KeptOnPhoneOutcomeProps = {
  /** The key of the record that was kept, to follow it through the outbox. */
  clientKey: string;
  /** What is in the outbox now. */
  onPhone: readonly OutboxEntry[];
  /** The record, as the start of a sentence: "The walk test of zone 3". */
  what: string;
  title?: string;
};

/**
 * A record kept on the phone, followed until it has gone: waiting, sent, or refused by the API
 * when it arrived. It goes inside the form's status region, so each change is announced.
 */
export function KeptOnPhoneOutcome({
  clientKey,
  onPhone,
  what,
  title = KEPT_ON_PHONE,
}: KeptOnPhoneOutcomeProps) {
  const entry = onPhone.find((item) => item.clientKey === clientKey);
  if (!entry) {
    return (
      <Notice
        tone="normal"
        title={`Sent: ${what.charAt(0).toLowerCase()}${what.slice(1)} reached Wardbook`}
      />
    );
  }
  if (entry.refusal) {
    return (
      <Notice tone="alarm" title="Not accepted when it was sent">
        <p>{entry.refusal}</p>
      </Notice>
    );
  }
  return (
    <Notice tone="info" icon={Smartphone} title={title}>
      <p>
        {what} is kept on this phone with the time it was done, and sent as soon as there is a
        connection. You can carry on.
      </p>
    </Notice>
  );
}
