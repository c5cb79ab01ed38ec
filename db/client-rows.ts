/**
 * The rows the libSQL client hands to drizzle, built cheaply.
 *
 * For a local file the client turns each row SQLite returns into an object
 * with `Object.defineProperty` twice per value (a hidden index and an
 * enumerable name), which leaves every row in V8's slow dictionary mode: for
 * the 61 lines of 30 columns an approval reads, about 0.65 ms, a fifth of the
 * decision's own time in a CPU profile; the approval page's 250 lines cost
 * four times that. The client has no option for it.
 *
 * The rows built here answer the same way: each column's value by its name
 * (own, enumerable, the first of two same-named columns winning, as in the
 * client), by its index and `length` (drizzle reads every mapped select that
 * way), and the same values (integers as numbers, a range error beyond 2^53,
 * blobs as their ArrayBuffer: the client's default integer mode, the one
 * db/client.ts uses). The index and length come from a prototype made once
 * per column list, reading a private field, so the names stay the only keys
 * `Object.keys`, JSON and test equality see.
 */

type Build = (values: unknown[]) => object;

const MIN_SAFE = BigInt(Number.MIN_SAFE_INTEGER);
const MAX_SAFE = BigInt(Number.MAX_SAFE_INTEGER);

/** The client's own conversion of one value in its "number" integer mode. */
function fromSql(value: unknown): unknown {
  if (typeof value === "bigint") {
    if (value < MIN_SAFE || value > MAX_SAFE) throw new RangeError("Received integer which cannot be safely represented as a JavaScript number");
    return Number(value);
  }
  return value instanceof Buffer ? value.buffer : value;
}

function rowBuilder(columns: readonly string[]): Build {
  const named = columns.map((name, i) => columns.indexOf(name) === i);
  class Row {
    readonly #values: unknown[];
    constructor(values: unknown[]) {
      this.#values = values;
      const self = this as unknown as Record<string, unknown>;
      for (let i = 0; i < values.length; i++) {
        const value = fromSql(values[i]);
        values[i] = value;
        if (named[i]) self[columns[i]!] = value;
      }
    }
    static at(row: Row, i: number): unknown {
      return row.#values[i];
    }
  }
  Object.defineProperty(Row.prototype, "length", { value: columns.length });
  for (let i = 0; i < columns.length; i++) Object.defineProperty(Row.prototype, i, { get: function (this: Row) { return Row.at(this, i); } });
  return (values) => new Row(values);
}

const builders = new WeakMap<readonly string[], Build>();

/**
 * `rows` as a statement in raw mode returned them (arrays of values), made
 * ready for the client: its `map` (the client's one use of them, with its own
 * converter) builds the rows above instead. `columns` is the statement's
 * column list, kept with the statement (db/statement-cache.ts), so a builder
 * is made once per statement.
 */
export function clientRows(rows: unknown[], columns: readonly string[]): unknown[] {
  if (rows.length === 0 || !Array.isArray(rows[0])) return rows;
  let build = builders.get(columns);
  if (!build) {
    build = rowBuilder(columns);
    builders.set(columns, build);
  }
  const make = build;
  Object.defineProperty(rows, "map", { value: () => Array.prototype.map.call(rows, (values: unknown[]) => make(values)), enumerable: false });
  return rows;
}
