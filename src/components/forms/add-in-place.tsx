import type { ReactNode, RefObject } from 'react';
import { Plus } from 'lucide-react';

import { InPlaceFormSection } from '@/components/forms/in-place-form-section';
import { Button } from '@/components/ui/button';
import { useInPlaceForm } from '@/lib/use-in-place-form';

type AddInPlaceProps = {
  /** The button's words: "Add keyholder". */
  addLabel: string;
  /** The open form's heading: "New keyholder". */
  formTitle: string;
  /** The add button, so the list can also send focus there, e.g. after an entry is removed. */
  addButtonRef: RefObject<HTMLButtonElement | null>;
  /** The form; `close` puts the add button back, with focus on it. */
  children: (form: { headingId: string; close: () => void }) => ReactNode;
};

/** The foot of a list's card: an add button that opens the form for a new entry in its place. */
export function AddInPlace({ addLabel, formTitle, addButtonRef, children }: AddInPlaceProps) {
  const { isOpen, open, close } = useInPlaceForm(addButtonRef);
  return (
    <div className="border-t border-hairline bg-paper px-4 py-5 md:px-5">
      {isOpen ? (
        <InPlaceFormSection title={formTitle} headingLevel={3}>
          {(headingId) => children({ headingId, close })}
        </InPlaceFormSection>
      ) : (
        <Button ref={addButtonRef} size="lg" onClick={open}>
          <Plus aria-hidden="true" className="size-5" />
          {addLabel}
        </Button>
      )}
    </div>
  );
}
