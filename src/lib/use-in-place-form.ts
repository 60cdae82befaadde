import { useEffect, useRef, useState, type RefObject } from 'react';

/**
 * A form that opens in place of the button that opened it ("Add keyholder", "Edit"). Closing the
 * form removes the field that had focus, so focus goes back to that button (`openerRef`) rather
 * than being dropped at the top of the page.
 */
export function useInPlaceForm(openerRef: RefObject<HTMLElement | null>) {
  const [isOpen, setIsOpen] = useState(false);
  const returnFocusToOpener = useRef(false);

  useEffect(() => {
    if (!isOpen && returnFocusToOpener.current) {
      returnFocusToOpener.current = false;
      openerRef.current?.focus();
    }
  }, [isOpen, openerRef]);

  const open = () => setIsOpen(true);
  const close = () => {
    returnFocusToOpener.current = true;
    setIsOpen(false);
  };

  return { isOpen, open, close };
}
