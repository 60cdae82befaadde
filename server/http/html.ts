/** Markup that is already safe; everything else interpolated into `html` is escaped. */
export class SafeHtml {
  constructor(readonly value: string) {}
  toString() {
    return this.value;
  }
}

const ESCAPES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (char) => ESCAPES[char]!);
}

type Interpolation = SafeHtml | string | number | null | undefined | false | Interpolation[];

function render(value: Interpolation): string {
  if (value === null || value === undefined || value === false) return '';
  if (Array.isArray(value)) return value.map(render).join('');
  if (value instanceof SafeHtml) return value.value;
  return escapeHtml(String(value));
}

export function html(strings: TemplateStringsArray, ...values: Interpolation[]): SafeHtml {
  return new SafeHtml(
    strings.reduce((out, text, index) => out + render(values[index - 1] ?? null) + text),
  );
}

/** Trusted markup produced by a library (e.g. oidc-provider's logout form). */
export function trusted(markup: string): SafeHtml {
  return new SafeHtml(markup);
}
