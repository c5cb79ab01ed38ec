import type { AnswerView, FieldView, OperationView, ReferenceView, SchemaView } from "@/lib/api-schema/reference";

/**
 * The fleet API's reference, rendered on the server from the OpenAPI document
 * (lib/api-schema/reference.ts): no script, nothing fetched, so it works
 * offline and under the app's Content-Security-Policy.
 */
const schemaAnchor = (name: string) => `schema-${name}`;

/** The document's descriptions mark code with backticks (CommonMark, as OpenAPI allows); shown as code here. */
export function Words({ text }: { text: string }) {
  return (
    <>
      {text.split(/(`[^`]+`)/).map((part, i) => (part.startsWith("`") && part.endsWith("`") && part.length > 2 ? <code key={i}>{part.slice(1, -1)}</code> : part))}
    </>
  );
}

function SchemaName({ name }: { name: string | null }) {
  if (!name) return null;
  return (
    <a href={`#${schemaAnchor(name)}`} className="font-mono">
      {name}
    </a>
  );
}

function FieldTable({ fields, caption, withIn }: { fields: (FieldView & { in?: string })[]; caption: string; withIn?: boolean }) {
  return (
    <div>
      {/* Cells wrap long names rather than scroll the table sideways on a phone. */}
      <table className="w-full border-collapse text-left text-sm [overflow-wrap:anywhere]">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-b border-rule">
            <th scope="col" className="py-1 pr-3">Name</th>
            {withIn ? <th scope="col" className="py-1 pr-3">In</th> : null}
            <th scope="col" className="py-1 pr-3">Type</th>
            <th scope="col" className="py-1">About</th>
          </tr>
        </thead>
        <tbody>
          {fields.map((f) => (
            <tr key={`${f.in ?? ""}${f.name}`} className="border-b border-rule align-top">
              <td className="py-1 pr-3 font-mono">
                {f.name}
                {f.required ? "" : "?"}
              </td>
              {withIn ? <td className="py-1 pr-3">{f.in}</td> : null}
              <td className="py-1 pr-3 break-words">{f.type}</td>
              <td className="py-1">
                <Words text={f.description} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function Answer({ a }: { a: AnswerView }) {
  return (
    <li className="py-1">
      <span className="font-mono font-semibold">{a.status}</span> <Words text={a.description} />{" "}
      {a.mediaType ? <span className="text-ink-soft">({a.mediaType}{a.schema ? ", " : ""}</span> : null}
      {a.schema ? <SchemaName name={a.schema} /> : null}
      {a.mediaType ? <span className="text-ink-soft">)</span> : null}
      {a.codes.length ? (
        <span className="block text-sm">
          Codes: {a.codes.map((c, i) => (
            <span key={c}>
              {i ? ", " : ""}
              <a href={`#problem-${c}`} className="font-mono">{c}</a>
            </span>
          ))}
        </span>
      ) : null}
    </li>
  );
}

function Operation({ op }: { op: OperationView }) {
  return (
    <section id={op.id} aria-labelledby={`${op.id}-title`} className="border-t border-rule py-4" data-testid="api-operation">
      <h3 id={`${op.id}-title`} className="font-mono text-base font-bold break-all">
        <span className="mr-2 rounded bg-ink px-1.5 py-0.5 text-white">{op.method}</span>
        {op.path}
      </h3>
      <p className="mt-1 font-semibold">{op.summary}</p>
      {op.description
        .split("\n\n")
        .filter(Boolean)
        .map((para) => (
          <p key={para} className="mt-1 text-sm">
            <Words text={para} />
          </p>
        ))}
      <p className="mt-1 text-sm text-ink-soft">
        Operation <code>{op.id}</code>
      </p>
      {op.parameters.length ? (
        <div className="mt-3">
          <h4 className="text-sm font-bold">Parameters</h4>
          <FieldTable fields={op.parameters} caption={`Parameters of ${op.method} ${op.path}`} withIn />
        </div>
      ) : null}
      {op.body ? (
        <div className="mt-3">
          <h4 className="text-sm font-bold">Request body</h4>
          <p className="text-sm">
            {op.body.mediaType}
            {op.body.schema ? ": " : ""}
            <SchemaName name={op.body.schema} />
            {op.body.description ? (
              <>
                {" — "}
                <Words text={op.body.description} />
              </>
            ) : null}
          </p>
        </div>
      ) : null}
      <div className="mt-3">
        <h4 className="text-sm font-bold">Answers</h4>
        <ul className="text-sm">
          {op.answers.map((a) => (
            <Answer key={a.status} a={a} />
          ))}
        </ul>
      </div>
    </section>
  );
}

function Schema({ s }: { s: SchemaView }) {
  return (
    <section id={schemaAnchor(s.name)} aria-labelledby={`${schemaAnchor(s.name)}-title`} className="border-t border-rule py-3">
      <h3 id={`${schemaAnchor(s.name)}-title`} className="font-mono text-base font-bold">{s.name}</h3>
      {s.description ? (
        <p className="text-sm">
          <Words text={s.description} />
        </p>
      ) : null}
      {s.fields.length ? <FieldTable fields={s.fields} caption={`Fields of ${s.name}`} /> : <p className="text-sm">{s.type}</p>}
    </section>
  );
}

export function ApiReference({ view }: { view: ReferenceView }) {
  return (
    <div className="flex flex-col gap-6">
      <nav aria-label="API reference contents" className="text-sm">
        <ul className="flex flex-wrap gap-x-4 gap-y-1">
          {view.tags.map((t) => (
            <li key={t.name}>
              <a href={`#tag-${t.name.replaceAll(" ", "-")}`}>{t.name}</a> ({t.operations.length})
            </li>
          ))}
          <li>
            <a href="#problem-codes">Problem codes</a>
          </li>
          <li>
            <a href="#schemas">Schemas</a>
          </li>
        </ul>
      </nav>
      {view.tags.map((t) => (
        <section key={t.name} id={`tag-${t.name.replaceAll(" ", "-")}`} aria-labelledby={`tag-${t.name.replaceAll(" ", "-")}-title`}>
          <h2 id={`tag-${t.name.replaceAll(" ", "-")}-title`} className="text-xl font-bold">{t.name}</h2>
          <p className="text-sm text-ink-soft">
            <Words text={t.description} />
          </p>
          {t.operations.map((op) => (
            <Operation key={op.id} op={op} />
          ))}
        </section>
      ))}
      <section id="problem-codes" aria-labelledby="problem-codes-title">
        <h2 id="problem-codes-title" className="text-xl font-bold">Problem codes</h2>
        <p className="text-sm">
          A refusal is an RFC 9457 problem document (<code>application/problem+json</code>) with <code>type</code>, <code>title</code>, <code>status</code>, <code>detail</code> and a
          stable <code>code</code>; see <SchemaName name="Problem" />. New codes may be added; none is renamed.
        </p>
        <dl className="mt-2 grid grid-cols-1 gap-x-4 text-sm sm:grid-cols-[max-content_1fr]">
          {view.problemCodes.map((p) => (
            <div key={p.code} className="contents">
              <dt id={`problem-${p.code}`} className="font-mono font-semibold">{p.code}</dt>
              <dd className="mb-1 text-ink-soft">{p.operations.length ? p.operations.join(", ") : "server actions and the app's own pages"}</dd>
            </div>
          ))}
        </dl>
      </section>
      <section id="schemas" aria-labelledby="schemas-title">
        <h2 id="schemas-title" className="text-xl font-bold">Schemas</h2>
        <p className="text-sm">A field marked <code>?</code> may be left out; money is integer cents; times are ISO 8601 in UTC.</p>
        {view.schemas.map((s) => (
          <Schema key={s.name} s={s} />
        ))}
      </section>
    </div>
  );
}
