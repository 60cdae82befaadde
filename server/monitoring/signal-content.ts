import { parseAdmCidData, parseSiaDcsData } from './protocol/contact-id';
import type { IncomingSignal } from './repository';

export type SignalContent = Pick<
  IncomingSignal,
  'eventCode' | 'category' | 'qualifier' | 'zoneOrUser' | 'partition'
> & {
  /** The account the data names, when it repeats it (`#1234|…`). */
  account: string | null;
};

/**
 * What an ADM-CID (Contact ID) or SIA-DCS payload says, whichever way it arrived: DC-09 over
 * TCP or JSON over HTTPS. Undefined for any other format, or data that is not that format.
 */
export function readSignalContent(protocol: string, data: string): SignalContent | undefined {
  if (protocol === 'ADM-CID') {
    const event = parseAdmCidData(data);
    if (!event) return undefined;
    return {
      account: event.account,
      eventCode: event.code,
      category: event.category,
      qualifier: event.qualifier,
      zoneOrUser: event.zoneOrUser,
      partition: event.partition,
    };
  }
  if (protocol === 'SIA-DCS') {
    const event = parseSiaDcsData(data);
    if (!event) return undefined;
    return {
      account: event.account,
      eventCode: event.code,
      category: event.category,
      qualifier: event.qualifier,
      zoneOrUser: event.zoneOrUser,
      partition: event.area,
    };
  }
  return undefined;
}
