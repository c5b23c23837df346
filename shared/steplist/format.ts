/**
 * Numbers as the plant reads them: rounded to what a scale or a dip stick
 * shows (the JSON keeps every number unrounded; only text is rounded).
 */
const formatters = new Map<number, Intl.NumberFormat>();
function formatter(digits: number): Intl.NumberFormat {
  let f = formatters.get(digits);
  if (!f) {
    f = new Intl.NumberFormat('en', { maximumFractionDigits: digits, minimumFractionDigits: 0 });
    formatters.set(digits, f);
  }
  return f;
}

/** Three significant figures below 100, whole numbers above. */
export function amount(x: number): string {
  const a = Math.abs(x);
  const digits = a >= 100 ? 0 : a >= 10 ? 1 : a >= 1 ? 2 : a >= 0.1 ? 3 : 4;
  return formatter(digits).format(x);
}

export const kg = (x: number) => `${amount(x)} kg`;
export const litres = (x: number) => `${amount(x)} L`;
export const celsius = (x: number) => `${formatter(0).format(x)} °C`;
export const mbar = (x: number) => `${formatter(0).format(x)} mbar`;
export const pct = (x: number, digits = 1) => `${formatter(digits).format(x)} %`;

/** Hours as "45 min" below 2 h, else "3.5 h". */
export function duration(hours: number): string {
  if (hours < 2) return `${Math.max(1, Math.round(hours * 60))} min`;
  return `${formatter(1).format(hours)} h`;
}

/** pH to one decimal. */
export const ph = (x: number) => formatter(1).format(x);
