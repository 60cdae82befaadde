/*
 * How many SMS parts a body needs, as the num_segments a real send would report. The GSM 7-bit
 * default alphabet and its extension table are those of 3GPP TS 23.038; a part holds 160
 * septets (153 once a concatenation header is needed) or 70 UCS-2 units (67), per TS 23.040.
 * Both from memory.
 */
const GSM_BASIC = new Set(
  '@£$¥èéùìòÇ\nØø\rÅåΔ_ΦΓΛΩΠΨΣΘΞÆæßÉ !"#¤%&\'()*+,-./0123456789:;<=>?' +
    '¡ABCDEFGHIJKLMNOPQRSTUVWXYZÄÖÑÜ§¿abcdefghijklmnopqrstuvwxyzäöñüà',
);
/** Sent as an escape and a second septet. */
const GSM_EXTENSION = new Set('^{}\\[~]|€\f');

export function segmentCount(body: string): number {
  let septets = 0;
  for (const char of body) {
    if (GSM_BASIC.has(char)) septets += 1;
    else if (GSM_EXTENSION.has(char)) septets += 2;
    else return parts(body.length, 70, 67);
  }
  return parts(septets, 160, 153);
}

function parts(units: number, single: number, perPart: number) {
  if (units === 0) return 1;
  return units <= single ? 1 : Math.ceil(units / perPart);
}
