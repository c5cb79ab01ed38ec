"use client";

import Link from "next/link";
import { useState, useTransition } from "react";
import { inputClass } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import { importUnitsAction, previewImportAction } from "@/lib/server/actions/units";
import type { CsvCheck } from "@/lib/units/csv-import";

/**
 * A fleet's unit list from a CSV file: read in the browser, checked on the
 * server row by row (nothing written), then imported whole, or not at all.
 */
export function CsvImport({ accountId, columns }: { accountId: string; columns: readonly string[] }) {
  const [csv, setCsv] = useState("");
  const [check, setCheck] = useState<CsvCheck | null>(null);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [done, setDone] = useState<number | null>(null);
  const [pending, start] = useTransition();
  const problems = check ? check.fileProblems.length + check.rows.reduce((n, r) => n + r.problems.length, 0) : 0;

  async function pick(file: File | undefined) {
    if (!file) return;
    setCsv(await file.text());
    setCheck(null);
    setMessage(null);
  }

  const preview = () =>
    start(async () => {
      setDone(null);
      const result = await previewImportAction({ accountId, csv });
      if (result.ok) {
        setCheck(result.data);
        setMessage(null);
      } else setMessage({ ok: false, text: result.error });
    });

  const runImport = () =>
    start(async () => {
      const result = await importUnitsAction({ accountId, csv });
      if (result.ok) {
        setDone(result.data.imported);
        setCheck(null);
        setCsv("");
      } else setMessage({ ok: false, text: result.error });
    });

  if (done !== null) {
    return (
      <div role="status" className="flex flex-col gap-2" data-testid="import-done">
        <p className="text-lg font-bold">Imported {done} unit{done === 1 ? "" : "s"}.</p>
        <p>
          <Link href={`/units?accountId=${accountId}`}>See this account&apos;s units</Link>
        </p>
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-4" data-testid="csv-import">
      <p className="text-sm text-ink-soft">
        A header row, then one unit a line. Columns Cotter reads: <code className="text-xs">{columns.join(", ")}</code>. Either a VIN, or <code>serialOnly</code> set to yes with a <code>serial</code>. Dates as YYYY-MM-DD; <code>inspectionBasis</code> is <code>periodic</code> or <code>state</code>.
      </p>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">CSV file</span>
        <input type="file" accept=".csv,text/csv" onChange={(e) => void pick(e.target.files?.[0])} className="text-sm" />
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">…or paste the text</span>
        <textarea
          value={csv}
          onChange={(e) => {
            setCsv(e.target.value);
            setCheck(null);
          }}
          rows={8}
          spellCheck={false}
          className={`${inputClass} py-2 font-mono text-sm`}
        />
      </label>
      <div className="flex flex-wrap gap-2">
        <Button type="button" variant="secondary" disabled={!csv.trim() || pending} onClick={preview}>
          {pending && !check ? "Checking…" : "Check the file"}
        </Button>
        {check && problems === 0 ? (
          <Button type="button" disabled={pending} onClick={runImport}>
            Import {check.units.length} unit{check.units.length === 1 ? "" : "s"}
          </Button>
        ) : null}
      </div>
      {message ? (
        <p role="alert" className="font-semibold text-rust-deep">
          {message.text}
        </p>
      ) : null}
      {check ? <Preview check={check} problems={problems} /> : null}
    </div>
  );
}

function Preview({ check, problems }: { check: CsvCheck; problems: number }) {
  return (
    <section aria-label="Preview" className="flex flex-col gap-2" data-testid="import-preview">
      <p role="status" className={`font-semibold ${problems ? "text-rust-deep" : ""}`}>
        {problems
          ? `${problems} problem${problems === 1 ? "" : "s"}: nothing will be imported until the file is fixed.`
          : `All ${check.units.length} rows are good. Nothing is written until you import.`}
      </p>
      {check.ignoredColumns.length ? <p className="text-sm text-ink-soft">Columns Cotter does not read, left out: {check.ignoredColumns.join(", ")}.</p> : null}
      {check.fileProblems.map((p, i) => (
        <p key={i} className="font-semibold text-rust-deep">
          {p.row ? `Line ${p.row}: ` : ""}
          {p.message}
        </p>
      ))}
      {check.rows.length ? (
        <div className="overflow-x-auto">
          <table className="w-full text-sm">
            <thead>
              <tr className="border-b-2 border-ink text-left">
                <th className="py-1 pr-3">Line</th>
                <th className="py-1 pr-3">Unit</th>
                <th className="py-1 pr-3">VIN</th>
                <th className="py-1 pr-3">Description</th>
                <th className="py-1">Problems</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-rule">
              {check.rows.map((r) => (
                <tr key={r.row} data-testid="import-row" data-ok={r.problems.length === 0} className="align-top">
                  <td className="figures py-1 pr-3">{r.row}</td>
                  <td className="py-1 pr-3 font-semibold">{r.unitNumber}</td>
                  <td className="figures py-1 pr-3 font-mono">{r.vin}</td>
                  <td className="py-1 pr-3">{r.description}</td>
                  <td className="py-1">
                    {r.problems.length === 0 ? (
                      <span>✓ Good</span>
                    ) : (
                      <ul className="font-semibold text-rust-deep">
                        {r.problems.map((p, i) => (
                          <li key={i}>
                            ✗ {p.field}: {p.message}
                          </li>
                        ))}
                      </ul>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
    </section>
  );
}
