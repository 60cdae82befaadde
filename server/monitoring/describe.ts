/**
 * A received signal in plain words for homeowners and staff. Contact ID 4xx openings (new) are
 * unsets and closings (restore) are sets (SIA DC-05); SIA-DCS says so in the code (OP, CL).
 */
export function describeSignal(signal: {
  category: string;
  qualifier: string;
  eventCode: string | null;
  zoneOrUser: number | null;
}): string {
  const restored = signal.qualifier === 'restore';
  const user = signal.zoneOrUser !== null ? ` by user ${signal.zoneOrUser}` : '';
  switch (signal.category) {
    case 'open_close': {
      const isSet = signal.eventCode === 'CL' || (signal.eventCode !== 'OP' && restored);
      return `${isSet ? 'Set' : 'Unset'}${user}`;
    }
    case 'burglary':
      return restored ? 'Intruder alarm cleared' : 'Intruder alarm';
    case 'hold_up':
      return restored ? 'Hold-up alarm cleared' : 'Hold-up alarm';
    case 'fire':
      return restored ? 'Fire alarm cleared' : 'Fire alarm';
    case 'tamper':
      return restored ? 'Tamper cleared' : 'Tamper';
    case 'fault':
      return restored ? 'Fault cleared' : 'Fault';
    case 'test':
      return 'Periodic test';
    default:
      return restored ? 'Signal cleared' : 'Signal';
  }
}
