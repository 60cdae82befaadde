type LiveMessageProps = { message: string };

/**
 * Says what just happened ("Sam Whitlock is now number 1") to screen-reader users without moving
 * focus. The element is always present so that assistive technology notices when its text changes.
 */
export function LiveMessage({ message }: LiveMessageProps) {
  return (
    <p role="status" className="sr-only">
      {message}
    </p>
  );
}
