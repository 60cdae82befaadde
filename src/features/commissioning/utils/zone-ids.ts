/** Element ids for a zone in the commissioning list, for links and for moving focus. */
export const zoneItemId = (zoneId: string) => `zone-item-${zoneId}`;
export const zonePanelHeadingId = (zoneId: string) => `zone-panel-${zoneId}-heading`;
