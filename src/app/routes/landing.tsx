import {
  BookCheck,
  Building2,
  ClipboardCheck,
  FileCheck,
  HardHat,
  Headset,
  House,
  KeyRound,
  LogIn,
  RadioTower,
  ShieldCheck,
  Wrench,
  type LucideIcon,
} from 'lucide-react';
import { useLoaderData } from 'react-router-dom';

import type { LandingLoaderData } from '@/app/route-loaders';
import { PublicLayout } from '@/components/layouts/public-layout';
import { buttonClassName } from '@/components/ui/button-styles';
import { LoopGauge, type LoopGaugeBand } from '@/components/ui/loop-gauge';
import { Notice } from '@/components/ui/notice';
import { paths } from '@/config/paths';

type Feature = { id: string; icon: LucideIcon; title: string; text: string };

const lifecycle: Feature[] = [
  {
    id: 'design',
    icon: ShieldCheck,
    title: 'Design to a security grade',
    text: 'Record the survey, the risks, and the EN 50131 grade and environmental class the system is built to, with the reasons.',
  },
  {
    id: 'commission',
    icon: ClipboardCheck,
    title: 'Commission and walk test',
    text: 'Walk-test every zone, read each loop’s resistance, size the standby battery and prove the signalling path.',
  },
  {
    id: 'handover',
    icon: FileCheck,
    title: 'Hand over a signed pack',
    text: 'Completion certificate, zone schedule, power budget and user information in one sealed handover pack, countersigned by the customer.',
  },
  {
    id: 'monitoring',
    icon: RadioTower,
    title: 'Monitoring and keyholder call-out',
    text: 'Signals reach the monitoring centre, which confirms alarms and works through the call plan of keyholders.',
  },
  {
    id: 'service',
    icon: Wrench,
    title: 'Years of service visits',
    text: 'Preventive visits planned and remembered, corrective call-outs logged, and every service report kept with the system.',
  },
];

const people: Feature[] = [
  {
    id: 'engineers',
    icon: HardHat,
    title: 'Engineers',
    text: 'Record systems, zones and readings on site, commission them and issue the handover pack.',
  },
  {
    id: 'office',
    icon: Building2,
    title: 'Office',
    text: 'Invite people, plan visits and keep the company’s records and audit trail in order.',
  },
  {
    id: 'homeowners',
    icon: House,
    title: 'Homeowners',
    text: 'See their own system, documents and service history, and choose their keyholders.',
  },
  {
    id: 'keyholders',
    icon: KeyRound,
    title: 'Keyholders',
    text: 'Get only what they need to respond: access notes, the call plan, and a quick way to answer.',
  },
  {
    id: 'monitoring-centre',
    icon: Headset,
    title: 'Monitoring centre',
    text: 'Work the signals from the systems it watches, call keyholders and record each outcome.',
  },
];

// An illustrative two-resistor loop: 2k2 tamper resistor in series, 4k7 alarm resistor across the
// contact, so a closed (normal) contact reads 2.2 kΩ and an open (alarm) one 2.2 + 4.7 = 6.9 kΩ.
// The bands here are round illustrative margins; real bands come from the loop calculations.
const exampleBands: LoopGaugeBand[] = [
  { state: 'short', fromOhms: 0, toOhms: 500 },
  { state: 'normal', fromOhms: 1_950, toOhms: 2_450 },
  { state: 'alarm', fromOhms: 6_200, toOhms: 7_600 },
  { state: 'open', fromOhms: 20_000, toOhms: null },
];

function FeatureList({ features, numbered }: { features: Feature[]; numbered?: boolean }) {
  const List = numbered ? 'ol' : 'ul';
  return (
    <List className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
      {features.map((feature, index) => (
        <li key={feature.id} className="rounded-lg border border-hairline bg-white p-5">
          <div className="flex items-center gap-3">
            <feature.icon aria-hidden="true" className="size-6 shrink-0 text-ink" />
            <h3 className="font-semibold">
              {numbered ? (
                <span className="mr-2 font-mono text-sm text-ink-muted">{index + 1}.</span>
              ) : null}
              {feature.title}
            </h3>
          </div>
          <p className="mt-2 text-sm text-ink-muted">{feature.text}</p>
        </li>
      ))}
    </List>
  );
}

export function LandingRoute() {
  const { sessionCheck } = useLoaderData() as LandingLoaderData;

  return (
    <PublicLayout>
      <title>Wardbook: the book of record for intruder-alarm systems</title>
      <section className="border-b border-hairline">
        <div className="mx-auto grid max-w-6xl items-center gap-10 px-4 py-12 md:px-6 md:py-16 lg:grid-cols-[minmax(0,1fr)_26rem]">
          <div>
            <p className="font-semibold tracking-wide text-ink-muted">
              For small intruder-alarm companies
            </p>
            <h1 className="mt-2 text-3xl font-bold tracking-tight md:text-5xl">
              The book of record for every alarm system you install
            </h1>
            <p className="mt-5 max-w-prose text-lg text-ink-muted">
              Wardbook keeps each intruder-alarm system’s story in one place, from survey to years
              of service, and connects the people around it: your engineers and office, the
              homeowner, their keyholders and the monitoring centre.
            </p>
            {sessionCheck === 'unavailable' ? (
              <Notice tone="fault" title="Wardbook’s server is not answering" className="mt-6">
                We could not check whether you are already signed in. You can still try to sign in;
                if that fails too, try again in a few minutes.
              </Notice>
            ) : null}
            <div className="mt-8 flex flex-wrap items-center gap-4">
              {/* Sign-in is served by the API: a real link, so the browser leaves the app. */}
              <a href={paths.auth.login.getHref()} className={buttonClassName({ size: 'lg' })}>
                <LogIn aria-hidden="true" className="size-5" />
                Sign in
              </a>
              <p className="max-w-xs text-sm text-ink-muted">
                Accounts are by invitation from your alarm company or monitoring centre.
              </p>
            </div>
          </div>
          <div className="rounded-lg border border-hairline bg-white p-5 shadow-sm">
            <p className="flex items-center gap-2 text-sm font-semibold">
              <BookCheck aria-hidden="true" className="size-4 text-ink" />
              Example walk-test reading
            </p>
            <dl className="mt-4 grid grid-cols-2 gap-x-4 gap-y-2 text-sm">
              <dt className="text-ink-muted">Zone</dt>
              <dd className="font-mono">01 Front door</dd>
              <dt className="text-ink-muted">Zone type</dt>
              <dd>Entry/exit</dd>
              <dt className="text-ink-muted">Loop wiring</dt>
              <dd>Two-resistor loop</dd>
            </dl>
            <LoopGauge bands={exampleBands} readingOhms={2_210} className="mt-5" />
          </div>
        </div>
      </section>

      <section aria-labelledby="lifecycle-heading" className="mx-auto max-w-6xl px-4 py-12 md:px-6">
        <h2 id="lifecycle-heading" className="text-2xl font-semibold tracking-tight">
          From survey to service
        </h2>
        <p className="mt-2 mb-6 max-w-prose text-ink-muted">
          One record follows each system through its whole life.
        </p>
        <FeatureList features={lifecycle} numbered />
      </section>

      <section aria-labelledby="people-heading" className="mx-auto max-w-6xl px-4 pb-12 md:px-6">
        <h2 id="people-heading" className="text-2xl font-semibold tracking-tight">
          Everyone around the system
        </h2>
        <p className="mt-2 mb-6 max-w-prose text-ink-muted">
          Each person sees what their role needs and nothing from anyone else’s sites.
        </p>
        <FeatureList features={people} />
      </section>

      <section className="border-t border-hairline bg-white">
        <p className="mx-auto flex max-w-6xl items-start gap-3 px-4 py-6 text-sm text-ink-muted md:px-6">
          <ShieldCheck aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-ink" />
          Wherever someone may climb, drill, open a panel or attend an alarm, Wardbook shows the
          usual safety cautions, deferring to local codes and licensed practice.
        </p>
      </section>
    </PublicLayout>
  );
}
