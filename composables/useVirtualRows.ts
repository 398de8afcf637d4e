import type { ComponentPublicInstance } from 'vue'
import { defaultRangeExtractor, useVirtualizer } from '@tanstack/vue-virtual'

interface VirtualRowsOptions {
  /** Expected row height; rows are measured once drawn. */
  rowPx: number
  /** Height of the sticky table head inside the scroller, kept clear when a row is scrolled to. */
  headPx?: number
  /** Rows drawn beyond each edge of the view, so Tab and the arrow keys find their next row already there. */
  overscan?: number
  /** A row kept drawn when scrolled away (the one being edited keeps its typed text and focus). */
  pinned?: MaybeRefOrGetter<number | null>
}

/**
 * Only the rows in view of a scrolling table are drawn (TanStack Virtual); spacer rows stand for the
 * rest, so a 5,000-waypoint plan scrolls and edits like a short one. Rows carry `data-index` so their
 * measured height replaces the estimate. The server draws the first screenful.
 */
export function useVirtualRows(count: MaybeRefOrGetter<number>, o: VirtualRowsOptions) {
  const scroller = ref<HTMLElement | null>(null)
  const virtualizer = useVirtualizer(computed(() => {
    const pinned = toValue(o.pinned) ?? null
    return {
      count: toValue(count),
      getScrollElement: () => scroller.value,
      estimateSize: () => o.rowPx,
      overscan: o.overscan ?? 10,
      scrollPaddingStart: o.headPx ?? 0,
      initialRect: { width: 1000, height: 900 },
      rangeExtractor: (range: Parameters<typeof defaultRangeExtractor>[0]) => {
        const shown = defaultRangeExtractor(range)
        if (pinned == null || pinned >= range.count || shown.includes(pinned)) return shown
        return pinned < shown[0]! ? [pinned, ...shown] : [...shown, pinned]
      },
    }
  }))
  /** The rows to draw, each with the height of the spacer before it. */
  const rows = computed(() => {
    const n = toValue(count)
    let end = 0
    return virtualizer.value.getVirtualItems().filter(v => v.index < n).map((v) => {
      const gapPx = Math.max(0, v.start - end)
      end = v.end
      return { index: v.index, gapPx }
    })
  })
  const padBottom = computed(() => {
    const last = virtualizer.value.getVirtualItems().at(-1)
    return Math.max(0, virtualizer.value.getTotalSize() - (last?.end ?? 0))
  })

  // Vue calls a function ref on every render of the row: measure each row element once (a forced
  // layout), after which TanStack's ResizeObserver reports any change of its height.
  const measured = new WeakSet<Element>()
  function measure(target: Element | ComponentPublicInstance | null) {
    const el = target && '$el' in target ? target.$el as Element : target
    if (el?.nodeType !== 1 || measured.has(el)) return
    measured.add(el)
    virtualizer.value.measureElement(el)
  }

  /** Scrolls row `i` into view (only if it is not) and resolves with its element once it is drawn. */
  async function reveal(i: number, find: () => Element | null) {
    if (i < 0 || i >= toValue(count)) return null
    virtualizer.value.scrollToIndex(i, { align: 'auto' })
    for (let k = 0; k < 10 && !find(); k++) {
      await nextTick()
      await new Promise(r => requestAnimationFrame(r))
    }
    return find()
  }

  return { scroller, rows, padBottom, measure, reveal }
}
