// Engine result values in print: symbols for the physics (δ, σ, ρ, μr, η, f_g)
// and units from the field names' suffixes (depthMm → mm, frequencyHz → Hz).
const SYMBOLS: Record<string, string> = {
  standardDepthMm: 'δ',
  effectiveDepthMm: '3δ',
  conductivityMsPerM: 'σ',
  resistivityMicroOhmCm: 'ρ',
  relativePermeability: 'μr',
  fillFactor: 'η',
  limitFrequencyHz: 'f_g',
  frequencyHz: 'f',
  frequencyRatio: 'f/f_g',
};

const UNITS: [RegExp, string][] = [
  [/Mm$/, ' mm'],
  [/Hz$/, ' Hz'],
  [/MsPerM$/, ' MS/m'],
  [/MicroOhmCm$/, ' µΩ·cm'],
  [/Iacs$/, ' %IACS'],
  [/Deg$/, '°'],
  [/Percent$/, ' %'],
];

export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  if (value !== 0 && (Math.abs(value) >= 1e5 || Math.abs(value) < 1e-3)) return value.toPrecision(3);
  return String(Number(value.toPrecision(4)));
}

function formatHz(value: number): string {
  if (value >= 1e6) return `${formatNumber(value / 1e6)} MHz`;
  if (value >= 1e3) return `${formatNumber(value / 1e3)} kHz`;
  return `${formatNumber(value)} Hz`;
}

function formatScalar(key: string, value: unknown): string {
  if (typeof value === 'number') {
    if (/Hz$/.test(key)) return formatHz(value);
    const unit = UNITS.find(([pattern]) => pattern.test(key))?.[1] ?? '';
    return `${formatNumber(value)}${unit}`;
  }
  if (value === null || value === undefined) return '—';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (Array.isArray(value)) return value.map((item) => formatScalar(key, item)).join(', ');
  if (typeof value === 'object') return JSON.stringify(value);
  return String(value);
}

export function formatValue(key: string, value: unknown): string {
  const symbol = SYMBOLS[key];
  return `${symbol ?? key} = ${formatScalar(key, value)}`;
}

export function formatValues(values: Record<string, unknown> | null | undefined): string {
  if (!values) return '';
  return Object.entries(values)
    .map(([key, value]) => formatValue(key, value))
    .join('; ');
}

export { formatHz };
