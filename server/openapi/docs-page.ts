type Schema = Record<string, unknown>;

const esc = (s: unknown): string => String(s).replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const refName = (ref: unknown): string => String(ref).slice(String(ref).lastIndexOf('/') + 1);

/** A schema in a few words: its type (or the schema it names) and its limits. */
function describe(s: Schema | undefined): string {
  if (!s) return '';
  if (s.$ref) return `<a href="#schema-${esc(refName(s.$ref))}">${esc(refName(s.$ref))}</a>`;
  if (Array.isArray(s.oneOf)) return (s.oneOf as Schema[]).map(describe).join(' or ');
  const parts: string[] = [];
  if (s.type === 'array') parts.push(`list of ${describe(s.items as Schema) || 'values'}`);
  else if (s.type) parts.push(esc(Array.isArray(s.type) ? s.type.join(' or ') : s.type));
  if (s.enum) parts.push(`one of ${(s.enum as unknown[]).map((v) => `<code>${esc(v)}</code>`).join(', ')}`);
  if (s.format) parts.push(esc(s.format));
  if (s.minimum !== undefined) parts.push(`≥ ${esc(s.minimum)}`);
  if (s.exclusiveMinimum !== undefined) parts.push(`&gt; ${esc(s.exclusiveMinimum)}`);
  if (s.maximum !== undefined) parts.push(`≤ ${esc(s.maximum)}`);
  if (s.minLength !== undefined || s.maxLength !== undefined) parts.push(`${esc(s.minLength ?? 0)}–${esc(s.maxLength ?? '∞')} characters`);
  if (s.minItems !== undefined || s.maxItems !== undefined) parts.push(`${esc(s.minItems ?? 0)}–${esc(s.maxItems ?? '∞')} items`);
  if (s.pattern) parts.push(`matching <code>${esc(s.pattern)}</code>`);
  if (s.description) parts.push(`(${esc(s.description)})`);
  return parts.join(', ');
}

function fieldTable(s: Schema): string {
  const required = new Set((s.required as string[] | undefined) ?? []);
  const rows = Object.entries((s.properties ?? {}) as Record<string, Schema>)
    .map(([name, p]) => `<tr><td><code>${esc(name)}</code></td><td>${required.has(name) ? 'yes' : ''}</td><td>${describe(p)}</td></tr>`)
    .join('');
  return `<table><thead><tr><th>field</th><th>required</th><th>what it takes</th></tr></thead><tbody>${rows}</tbody></table>`;
}

/**
 * The API description as one page, rendered on the server: no script, and its one <style> carries the response's
 * nonce, as the Content-Security-Policy asks.
 */
export function docsPage(doc: Schema, nonce: string): string {
  const paths = doc.paths as Record<string, Record<string, Schema>>;
  const ops = Object.entries(paths).flatMap(([path, methods]) => Object.entries(methods).map(([method, op]) => ({ path, method, op })));
  const byTag = new Map<string, typeof ops>();
  for (const o of ops) {
    const tag = String((o.op.tags as string[] | undefined)?.[0] ?? 'other');
    byTag.set(tag, [...(byTag.get(tag) ?? []), o]);
  }
  const opHtml = ({ path, method, op }: (typeof ops)[number]) => {
    const roles = op['x-roles'] as string[] | undefined;
    const who = roles ? roles.join(', ') : op.security ? 'any signed-in account' : 'anyone';
    const body = (op.requestBody as Schema | undefined)?.content as Record<string, { schema: Schema }> | undefined;
    const params = ((op.parameters ?? []) as Schema[]).map((p) => `<li><code>${esc(p.name)}</code> (${esc(p.in)}${p.required ? ', required' : ''}): ${describe(p.schema as Schema)}</li>`).join('');
    const replies = Object.keys(op.responses as Schema).join(', ');
    return `<section class="op"><h3><span class="method">${esc(method.toUpperCase())}</span> <code>${esc(path)}</code></h3>
<p>${esc(op.summary)}</p><p class="meta">Who: ${esc(who)} · answers: ${esc(replies)}</p>
${params ? `<ul>${params}</ul>` : ''}${body ? Object.entries(body).map(([type, c]) => `<p class="meta">Body (${esc(type)}): ${describe(c.schema)}</p>`).join('') : ''}</section>`;
  };
  const schemas = (doc.components as { schemas: Record<string, Schema> }).schemas;
  const schemaHtml = Object.entries(schemas)
    .map(([name, s]) => `<section class="schema" id="schema-${esc(name)}"><h3>${esc(name)}</h3>${fieldTable(s)}</section>`)
    .join('');
  const info = doc.info as Schema;
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${esc(info.title)}</title><style nonce="${esc(nonce)}">
body{font:15px/1.5 system-ui,sans-serif;margin:0 auto;max-width:64rem;padding:1rem 1.5rem;color:#1d2329}
h1{margin-bottom:.25rem}h2{border-bottom:2px solid #d5dbe1;margin-top:2rem;text-transform:capitalize}
.op,.schema{border:1px solid #d5dbe1;border-radius:6px;margin:.75rem 0;padding:.25rem 1rem}
.method{background:#24527a;border-radius:4px;color:#fff;font-size:.8em;padding:.1rem .4rem}
.meta{color:#4a5561}table{border-collapse:collapse;width:100%}td,th{border-bottom:1px solid #e6eaee;padding:.25rem;text-align:left;vertical-align:top}
code{background:#f1f3f5;border-radius:3px;padding:0 .2rem}
</style></head><body><h1>${esc(info.title)}</h1><p>${esc(info.description)}</p>
<p>The machine-readable description is <a href="/api/openapi.json">/api/openapi.json</a> (OpenAPI ${esc(doc.openapi)}).</p>
<nav><ul>${[...byTag.keys()].map((t) => `<li><a href="#tag-${esc(t)}">${esc(t)}</a></li>`).join('')}<li><a href="#schemas">Request schemas</a></li></ul></nav>
${[...byTag].map(([tag, list]) => `<h2 id="tag-${esc(tag)}">${esc(tag)}</h2>${list.map(opHtml).join('')}`).join('')}
<h2 id="schemas">Request schemas</h2>${schemaHtml}</body></html>`;
}
