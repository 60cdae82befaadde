import { DEVICE_KIND_LABELS, type Device } from '@server/devices/schema';
import type { SystemRecord } from '@server/systems/schema';
import type { Zone } from '@server/zones/schema';
import type { PowerBudgetItem } from '@/components/ui/power-budget-summary';

/**
 * The items the API sums for the site's power budget, listed the way it lists them: the panel
 * when a current is recorded for it, then every zone and device that draws current. The API
 * sends only the totals, so the list is rebuilt here from the saved record for checking by hand.
 */
export function powerItemsOf(
  system: Pick<SystemRecord, 'panelQuiescentMa' | 'panelAlarmMa'>,
  zones: readonly Pick<Zone, 'number' | 'location' | 'quiescentMa' | 'alarmMa'>[],
  devices: readonly Pick<Device, 'kind' | 'location' | 'quiescentMa' | 'alarmMa'>[],
): PowerBudgetItem[] {
  const items: PowerBudgetItem[] = [];
  if (system.panelQuiescentMa !== null || system.panelAlarmMa !== null) {
    items.push({
      label: 'Control panel',
      quiescentMa: system.panelQuiescentMa ?? 0,
      alarmMa: system.panelAlarmMa ?? 0,
    });
  }
  for (const zone of zones) {
    if (zone.quiescentMa || zone.alarmMa) {
      items.push({
        label: `Zone ${zone.number} (${zone.location})`,
        quiescentMa: zone.quiescentMa ?? 0,
        alarmMa: zone.alarmMa ?? 0,
      });
    }
  }
  for (const device of devices) {
    if (device.quiescentMa || device.alarmMa) {
      items.push({
        label: `${DEVICE_KIND_LABELS[device.kind]} (${device.location})`,
        quiescentMa: device.quiescentMa ?? 0,
        alarmMa: device.alarmMa ?? 0,
      });
    }
  }
  return items;
}
