import type { MyHome } from '@server/my/schema';
import { Phone } from 'lucide-react';
import type { ReactNode } from 'react';

import { Card } from '@/components/ui/card';
import { TelLink } from '@/components/ui/tel-link';

function ContactLine({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="grid gap-0.5">
      <dt className="text-sm text-ink-muted">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}

type WhoToCallCardProps = { home: MyHome; headingLevel?: 2 | 3 };

/** The numbers a homeowner needs when the alarm goes off, and what to do after a false alarm. */
export function WhoToCallCard({ home, headingLevel = 2 }: WhoToCallCardProps) {
  const { installer, monitoringCentre } = home;
  return (
    <Card title="Who to call" icon={Phone} headingLevel={headingLevel}>
      <div className="grid gap-5">
        <div className="grid gap-2">
          <p className="font-semibold">Your alarm company: {installer.name}</p>
          <dl className="grid gap-2">
            {installer.phone ? (
              <ContactLine label="Office hours">
                <TelLink
                  phone={installer.phone}
                  large
                  accessiblePrefix={`Call ${installer.name} on`}
                />
              </ContactLine>
            ) : null}
            {installer.outOfHoursPhone ? (
              <ContactLine label="Out of hours">
                <TelLink
                  phone={installer.outOfHoursPhone}
                  large
                  accessiblePrefix={`Call ${installer.name} out of hours on`}
                />
              </ContactLine>
            ) : null}
            {installer.email ? (
              <ContactLine label="E-mail">
                <a
                  href={`mailto:${installer.email}`}
                  className="inline-flex min-h-11 items-center break-all"
                >
                  {installer.email}
                </a>
              </ContactLine>
            ) : null}
            {!installer.phone && !installer.outOfHoursPhone && !installer.email ? (
              <p className="text-ink-muted">
                Your alarm company has not added its contact details to Wardbook yet.
              </p>
            ) : null}
          </dl>
        </div>

        {monitoringCentre ? (
          <div className="grid gap-2 border-t border-hairline pt-4">
            <p className="font-semibold">Monitoring centre: {monitoringCentre.name}</p>
            <dl className="grid gap-2">
              {monitoringCentre.phone ? (
                <ContactLine label="Phone">
                  <TelLink
                    phone={monitoringCentre.phone}
                    large
                    accessiblePrefix={`Call ${monitoringCentre.name} on`}
                  />
                </ContactLine>
              ) : null}
              {monitoringCentre.outOfHoursPhone ? (
                <ContactLine label="Other number">
                  <TelLink
                    phone={monitoringCentre.outOfHoursPhone}
                    large
                    accessiblePrefix={`Call ${monitoringCentre.name} on`}
                  />
                </ContactLine>
              ) : null}
              {home.monitoringAccount ? (
                <ContactLine label="Your account number (quote it when you call)">
                  <span className="font-mono text-lg">{home.monitoringAccount}</span>
                </ContactLine>
              ) : null}
            </dl>
          </div>
        ) : (
          <p className="border-t border-hairline pt-4 text-ink-muted">
            This system is not monitored: nobody is called automatically when it goes off.
          </p>
        )}

        <div className="grid gap-2 border-t border-hairline pt-4">
          <p className="font-semibold">After a false alarm</p>
          <ol className="grid list-decimal gap-1.5 pl-6">
            {monitoringCentre ? (
              <>
                <li>Stay by the phone: the monitoring centre will ring you.</li>
                <li>
                  Give them your password when they ask (the word agreed with the centre, never your
                  alarm code), and tell them it was a false alarm.
                </li>
              </>
            ) : null}
            <li>
              Do not set the system again until the cause is found. Call your alarm company if you
              cannot tell what set it off.
            </li>
          </ol>
        </div>
      </div>
    </Card>
  );
}
