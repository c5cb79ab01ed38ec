/**
 * Intl formatters are costly to build (a locale lookup each time) and cheap to
 * reuse: one per distinct key for the life of the process. Keys come from code
 * and the configured time zone, never from a request, so each map stays small.
 */
export function memoised<K, V>(make: (key: K) => V): (key: K) => V {
  const made = new Map<K, V>();
  return (key) => {
    let value = made.get(key);
    if (value === undefined) {
      value = make(key);
      made.set(key, value);
    }
    return value;
  };
}
