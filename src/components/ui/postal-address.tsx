import { cn } from '@/utils/cn';

export type PostalAddressLines = {
  addressLine1: string;
  addressLine2: string;
  town: string;
  postcode: string;
};

/** A UK address, one line per part, with the postcode in the monospace face. */
export function PostalAddress({
  address,
  className,
}: {
  address: PostalAddressLines;
  className?: string;
}) {
  const lines = [address.addressLine1, address.addressLine2, address.town].filter(Boolean);
  return (
    <address className={cn('not-italic', className)}>
      {lines.map((line, index) => (
        <span key={`${index}-${line}`} className="block">
          {line}
        </span>
      ))}
      <span className="block font-mono">{address.postcode}</span>
    </address>
  );
}
