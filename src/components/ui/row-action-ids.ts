/** The ids of a row's action buttons, so a list can put focus back on one after the row moves. */
export const rowActionIds = (idPrefix: string) => ({
  up: `${idPrefix}-move-up`,
  down: `${idPrefix}-move-down`,
  duplicate: `${idPrefix}-duplicate`,
  remove: `${idPrefix}-remove`,
});
