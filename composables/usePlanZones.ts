import type { ZoneSummary } from '#shared/types/zone'
import { prepareZones } from '#shared/utils/zones/prepare'
import { planZoneDistances } from '#shared/utils/zones/legZones'
import { zoneInput } from '#shared/utils/zones/stored'

/** Distances inside the company's zones for the draft as it is edited: the engine the server runs, in the browser. */
export function usePlanZones(zones: MaybeRefOrGetter<ZoneSummary[] | null | undefined>) {
  const store = usePlanDraftStore()
  const prepared = computed(() => prepareZones((toValue(zones) ?? []).map(zoneInput)))
  const result = computed(() => (store.legTable ? planZoneDistances(prepared.value, store.legTable.legs) : null))
  return { prepared, result }
}
