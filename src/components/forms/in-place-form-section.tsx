import { useId, type ReactNode } from 'react';

type InPlaceFormSectionProps = {
  title: string;
  /** 3 for a form at the foot of a card ("New keyholder"), 4 for one inside an entry of its list. */
  headingLevel: 3 | 4;
  /** The form, which takes its name from the heading. */
  children: (headingId: string) => ReactNode;
};

/** A form opened in place, under a heading that says what it adds or changes. */
export function InPlaceFormSection({ title, headingLevel, children }: InPlaceFormSectionProps) {
  const headingId = useId();
  const Heading = headingLevel === 3 ? 'h3' : 'h4';
  return (
    <section
      aria-labelledby={headingId}
      className={headingLevel === 3 ? 'grid gap-4' : 'grid gap-3'}
    >
      <Heading
        id={headingId}
        className={headingLevel === 3 ? 'text-lg font-semibold' : 'font-semibold'}
      >
        {title}
      </Heading>
      {children(headingId)}
    </section>
  );
}
