/**
 * The API document as a page for developers (GET /api/docs): plain HTML made on the server from the
 * OpenAPI document itself, so the page shows exactly what /api/openapi.json says. No script, no font
 * or style from anywhere else (the app's Content-Security-Policy would refuse them anyway): it opens
 * offline, and a schema is a folded block of JSON to read or copy.
 */
type Json = Record<string, unknown>;

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
export const escapeHtml = (text: string): string => text.replace(/[&<>"']/g, (c) => ESCAPES[c] ?? c);

const obj = (v: unknown): Json => (v !== null && typeof v === 'object' && !Array.isArray(v) ? (v as Json) : {});
const arr = (v: unknown): unknown[] => (Array.isArray(v) ? v : []);
const str = (v: unknown): string => (typeof v === 'string' ? v : '');

const METHODS = ['get', 'post', 'put', 'patch', 'delete'] as const;

/** Who may call it, in words, from the document's x-policy. */
export function policyWords(policy: Json): string {
  if (policy.kind === 'public') return 'Anyone (no sign-in)';
  if (policy.kind === 'roles') return `Signed in as ${arr(policy.roles).map(String).join(', ')}`;
  if (policy.kind === 'link')
    return `A customer's proposal-link session, for the proposal in {${str(policy.param)}} only`;
  if (policy.kind === 'signed') return 'A signed webhook (no session or CSRF; the signature is checked)';
  return 'Unknown policy';
}

/** A parameter's schema in a few words: its type and the bounds that matter when calling. */
function schemaWords(schema: Json): string {
  const parts: string[] = [];
  if (Array.isArray(schema.enum)) parts.push(`one of ${schema.enum.map(String).join(', ')}`);
  else if (typeof schema.type === 'string')
    parts.push(schema.format ? `${schema.type} (${str(schema.format)})` : schema.type);
  else if (Array.isArray(schema.anyOf)) parts.push(schema.anyOf.map((s) => schemaWords(obj(s))).join(' or '));
  if (typeof schema.minimum === 'number') parts.push(`≥ ${schema.minimum}`);
  if (typeof schema.maximum === 'number') parts.push(`≤ ${schema.maximum}`);
  if (typeof schema.maxLength === 'number') parts.push(`at most ${schema.maxLength} characters`);
  if (typeof schema.pattern === 'string' && !schema.format) parts.push(`matching ${schema.pattern}`);
  if (schema.default !== undefined) parts.push(`default ${JSON.stringify(schema.default)}`);
  return parts.join(', ') || 'any';
}

const folded = (label: string, schema: unknown): string =>
  `<details><summary>${escapeHtml(label)}</summary><pre>${escapeHtml(JSON.stringify(schema, null, 2))}</pre></details>`;

function operationHtml(path: string, method: string, op: Json): string {
  const id = str(op.operationId);
  const params = arr(op.parameters).map(obj);
  const paramRows = params
    .map(
      (p) =>
        `<tr><td><code>${escapeHtml(str(p.name))}</code><br><span class="where">${escapeHtml(str(p.in))}, ` +
        `${p.required ? 'required' : 'optional'}</span></td>` +
        `<td>${escapeHtml(str(p.description) || schemaWords(obj(p.schema)))}</td></tr>`,
    )
    .join('');
  const body = Object.entries(obj(obj(op.requestBody).content)).map(([type, c]) =>
    folded(`Body (${type})`, obj(c).schema ?? {}),
  );
  const answers = Object.entries(obj(op.responses)).map(([status, r]) => {
    const content = Object.entries(obj(obj(r).content));
    const words = `<span class="status s${escapeHtml(status[0] ?? '')}">${escapeHtml(status)}</span> ${escapeHtml(str(obj(r).description))}`;
    const schemas = content
      .filter(([type]) => type !== 'application/problem+json')
      .map(([type, c]) =>
        obj(c).schema ? folded(`Answer (${type})`, obj(c).schema) : ` <code>${escapeHtml(type)}</code>`,
      );
    return `<li>${words}${schemas.join('')}</li>`;
  });
  return `<section class="op" id="${escapeHtml(id)}">
<h3><span class="method m-${method}">${method.toUpperCase()}</span> <code>${escapeHtml(path)}</code></h3>
${op.summary ? `<p>${escapeHtml(str(op.summary))}</p>` : ''}
<p class="who">${escapeHtml(policyWords(obj(op['x-policy'])))}</p>
${params.length ? `<table><thead><tr><th>Parameter</th><th>What</th></tr></thead><tbody>${paramRows}</tbody></table>` : ''}
${body.join('')}
<ul class="answers">${answers.join('')}</ul>
</section>`;
}

/** The group a path belongs to: its first segment after /api (jobs, auth, company-data, …). */
const groupOf = (path: string): string => path.split('/')[2] ?? path;

const STYLE = `
body{margin:0;font:15px/1.5 system-ui,sans-serif;color:#1d2730;background:#f6f7f5}
header,main{max-width:70rem;margin:0 auto;padding:1rem}
header{border-bottom:1px solid #d5dad3}
h1{margin:.2rem 0;font-size:1.5rem} h2{margin-top:2rem;font-size:1.2rem;border-bottom:1px solid #d5dad3}
h3{margin:0;font-size:1rem;display:flex;gap:.5rem;align-items:baseline;flex-wrap:wrap}
code,pre{font:13px/1.45 ui-monospace,monospace} pre{overflow:auto;background:#fff;border:1px solid #d5dad3;padding:.5rem;max-height:28rem}
nav>ul{display:grid;grid-template-columns:repeat(auto-fill,minmax(19rem,1fr));gap:.5rem 1.5rem;padding:0;list-style:none}
nav ul ul{padding-left:1rem;list-style:none} nav li{overflow-wrap:anywhere} nav>ul>li>a{font-weight:700}
a{color:#1f5f8b} a:focus-visible,summary:focus-visible{outline:2px solid #1f5f8b;outline-offset:2px}
.op{background:#fff;border:1px solid #d5dad3;border-radius:6px;padding:.75rem;margin:.75rem 0;overflow-wrap:anywhere}
.method{font:700 12px ui-monospace,monospace;padding:.1rem .4rem;border-radius:4px;color:#fff;background:#4a5a66}
.m-get{background:#2d6a4f}.m-post{background:#1f5f8b}.m-put,.m-patch{background:#8a5a00}.m-delete{background:#9b2c2c}
.who{color:#4a5a66;margin:.25rem 0} table{border-collapse:collapse;margin:.5rem 0;width:100%}
td,th{border:1px solid #d5dad3;padding:.25rem .5rem;text-align:left;vertical-align:top;overflow-wrap:anywhere}
td:first-child,th:first-child{width:30%} .where{color:#4a5a66;font-size:13px} table{table-layout:fixed}
.answers{padding-left:1rem}.status{font-weight:700}.s2{color:#2d6a4f}.s4,.s5{color:#9b2c2c}
details{margin:.25rem 0} summary{cursor:pointer;color:#1f5f8b;min-height:1.5rem}
`;

/** The whole page for an OpenAPI document (as openApiDocument makes it). */
export function openApiPage(doc: Json): string {
  const info = obj(doc.info);
  const groups = new Map<string, string[]>();
  const toc = new Map<string, string[]>();
  for (const [path, item] of Object.entries(obj(doc.paths))) {
    for (const method of METHODS) {
      const op = obj(obj(item)[method]);
      if (!op.operationId) continue;
      const g = groupOf(path);
      groups.set(g, [...(groups.get(g) ?? []), operationHtml(path, method, op)]);
      const line = `<li><a href="#${escapeHtml(str(op.operationId))}">${method.toUpperCase()} ${escapeHtml(path)}</a></li>`;
      toc.set(g, [...(toc.get(g) ?? []), line]);
    }
  }
  const sections = [...groups.entries()].map(
    ([g, ops]) => `<h2 id="group-${escapeHtml(g)}">${escapeHtml(g)}</h2>${ops.join('\n')}`,
  );
  const nav = [...toc.entries()].map(
    ([g, lines]) => `<li><a href="#group-${escapeHtml(g)}">${escapeHtml(g)}</a><ul>${lines.join('')}</ul></li>`,
  );
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>${escapeHtml(str(info.title))} — routes</title><style>${STYLE}</style></head>
<body><header><h1>${escapeHtml(str(info.title))}</h1>
<p>Version ${escapeHtml(str(info.version))} · OpenAPI ${escapeHtml(str(doc.openapi))} · <a href="/api/openapi.json">the document as JSON</a></p>
<p>${escapeHtml(str(info.description))}</p></header>
<main><nav aria-label="Routes"><ul>${nav.join('')}</ul></nav>
<h2 id="problems">Problems</h2><p>Every error answers <code>application/problem+json</code>:</p>${folded('Problem', obj(obj(doc.components).schemas).Problem ?? {})}
${sections.join('\n')}</main></body></html>`;
}
