/**
 * One plain look for every e-mail: a heading, a few short paragraphs, one
 * button to the page that needs the reader. Pure: returns text and HTML.
 */
export interface MailContent {
  subject: string;
  heading: string;
  paragraphs: string[];
  facts?: [string, string][];
  action: { label: string; url: string };
  footer?: string;
}

export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
  link: string;
}

const escape = (s: string) =>
  s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

export function renderMail(content: MailContent): RenderedMail {
  const facts = content.facts ?? [];
  const text = [
    content.heading,
    "",
    ...content.paragraphs.flatMap((p) => [p, ""]),
    ...facts.map(([k, v]) => `${k}: ${v}`),
    ...(facts.length ? [""] : []),
    `${content.action.label}: ${content.action.url}`,
    "",
    content.footer ?? "Sent by Cotter.",
  ].join("\n");

  const html = `<!doctype html><html><body style="margin:0;background:#f6f1e7;font-family:Verdana,Arial,sans-serif;color:#2a2a28">
<div style="max-width:560px;margin:0 auto;padding:24px">
<p style="margin:0 0 16px;font-weight:bold;color:#b4501e">Cotter</p>
<h1 style="font-size:20px;margin:0 0 12px">${escape(content.heading)}</h1>
${content.paragraphs.map((p) => `<p style="font-size:15px;line-height:1.5;margin:0 0 12px">${escape(p)}</p>`).join("\n")}
${
  facts.length
    ? `<table style="font-size:14px;margin:0 0 16px;border-collapse:collapse">${facts
        .map(([k, v]) => `<tr><td style="padding:2px 12px 2px 0;color:#6e685e">${escape(k)}</td><td style="padding:2px 0">${escape(v)}</td></tr>`)
        .join("")}</table>`
    : ""
}
<p style="margin:20px 0"><a href="${escape(content.action.url)}" style="background:#b4501e;color:#ffffff;padding:12px 18px;border-radius:8px;text-decoration:none;font-weight:bold;display:inline-block">${escape(content.action.label)}</a></p>
<p style="font-size:12px;color:#6e685e">${escape(content.footer ?? "Sent by Cotter.")}<br>If the button does not work, open ${escape(content.action.url)}</p>
</div></body></html>`;

  return { subject: content.subject, text, html, link: content.action.url };
}
