/** Click-to-sort for a table: the key and direction, and the rows in that order. */
export function useSortedRows<T, K extends keyof T>(rows: MaybeRefOrGetter<readonly T[]>, initialKey: K, initiallyDescending = false) {
  const sortKey = ref(initialKey) as Ref<K>
  const descending = ref(initiallyDescending)
  const sorted = computed(() => {
    const dir = descending.value ? -1 : 1
    return [...toValue(rows)].sort((a, b) => {
      const x = a[sortKey.value] ?? ''
      const y = b[sortKey.value] ?? ''
      return (x < y ? -1 : x > y ? 1 : 0) * dir
    })
  })
  function sortBy(key: K) {
    if (sortKey.value === key) descending.value = !descending.value
    else { sortKey.value = key; descending.value = false }
  }
  return { sortKey, descending, sorted, sortBy }
}
