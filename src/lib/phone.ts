import { parsePhoneNumberFromString } from 'libphonenumber-js/min';

/**
 * The API stores numbers in E.164 ("+447700900123"); people read UK numbers the national way
 * ("07700 900123") and others in international form. Unreadable values are shown as they came.
 */
export function formatPhoneForReading(phone: string): string {
  const parsed = parsePhoneNumberFromString(phone, 'GB');
  if (!parsed) return phone;
  // By calling code, not country: the Ofcom drama range (07700 900xxx) has no country of its own.
  return parsed.countryCallingCode === '44'
    ? parsed.formatNational()
    : parsed.formatInternational();
}

/** A tel: link target that dials correctly from any country. */
export function phoneHref(phone: string): string {
  const parsed = parsePhoneNumberFromString(phone, 'GB');
  return `tel:${parsed ? parsed.number : phone.replace(/[^\d+]/g, '')}`;
}
