import { DETECTOR_KIND_LABELS, ZONE_TYPE_LABELS, type ZoneSchedule } from '@server/zones/schema';
import { ListOrdered } from 'lucide-react';

import { Card } from '@/components/ui/card';

type HomeZonesListProps = { schedule: ZoneSchedule };

/** The zones as fitted, read-only: where each detector is and what kind of zone it is on. */
export function HomeZonesList({ schedule }: HomeZonesListProps) {
  const areaNames = new Map(
    schedule.areas.map((area) => [area.id, area.name || `Area ${area.number}`]),
  );
  return (
    <Card title="Zones" icon={ListOrdered} flush>
      <p className="border-b border-hairline px-4 py-3 text-ink-muted md:px-5">
        Each zone is one detector or group of detectors wired to the control panel. The numbers
        match what the keypad shows, which helps when you tell your alarm company about a fault.
      </p>
      {schedule.zonesVersion === null ? (
        <p className="px-4 py-4 md:px-5">
          Your alarm company has not recorded your system in Wardbook yet.
        </p>
      ) : schedule.zones.length === 0 ? (
        <p className="px-4 py-4 md:px-5">No zones are recorded yet.</p>
      ) : (
        <ul aria-label="Zones" className="divide-y divide-hairline">
          {schedule.zones.map((zone) => (
            <li key={zone.id} className="grid gap-1 px-4 py-3 md:px-5">
              <h3 className="font-semibold">
                <span className="font-mono">Zone {zone.number}</span>: {zone.location}
              </h3>
              <p>
                {ZONE_TYPE_LABELS[zone.zoneType]} · {DETECTOR_KIND_LABELS[zone.detectorKind]}
                {zone.areaId && areaNames.get(zone.areaId)
                  ? ` · ${areaNames.get(zone.areaId)}`
                  : null}
              </p>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
