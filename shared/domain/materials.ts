// The materials library the server seeds: conductivity of common alloys (docs/domain-rules.md, "Materials library").
// Values are nominal; a technique should use the conductivity measured on the part
// or its reference standard where it matters.

export interface MaterialEntry {
  /** Stable identifier for seeding and look-ups. */
  id: string;
  name: string;
  conductivityIacs: number;
  relativePermeability: number;
  /** Where the value comes from, with its tag: [pub] published, [trade] common practice, [mem] from memory. */
  source: string;
}

const PUBLISHED_TABLE = '[pub] conductivity table of a published eddy current programmed-instruction text';

export const MATERIALS: readonly MaterialEntry[] = Object.freeze([
  { id: 'copper-annealed', name: 'Annealed copper', conductivityIacs: 100, relativePermeability: 1, source: '[pub] definition of the IACS scale: 100 %IACS = 58.0 MS/m at 20 °C (ASTM E1004)' },
  { id: 'aluminium-pure', name: 'Pure aluminium', conductivityIacs: 61, relativePermeability: 1, source: PUBLISHED_TABLE },
  { id: 'aluminium-6061-t6', name: 'Aluminium 6061-T6', conductivityIacs: 42, relativePermeability: 1, source: PUBLISHED_TABLE },
  { id: 'aluminium-7075-t6', name: 'Aluminium 7075-T6', conductivityIacs: 32, relativePermeability: 1, source: PUBLISHED_TABLE },
  { id: 'aluminium-2024-t3', name: 'Aluminium 2024-T3', conductivityIacs: 30, relativePermeability: 1, source: PUBLISHED_TABLE },
  { id: 'brass-70-30', name: '70/30 brass', conductivityIacs: 28, relativePermeability: 1, source: PUBLISHED_TABLE },
  { id: 'titanium-cp', name: 'Titanium, commercially pure', conductivityIacs: 3.1, relativePermeability: 1, source: PUBLISHED_TABLE },
  { id: 'stainless-304', name: 'Stainless steel 304', conductivityIacs: 2.5, relativePermeability: 1, source: PUBLISHED_TABLE },
  { id: 'alloy-600', name: 'Alloy 600 (UNS N06600)', conductivityIacs: 1.7, relativePermeability: 1, source: PUBLISHED_TABLE },
  { id: 'titanium-6al-4v', name: 'Ti-6Al-4V', conductivityIacs: 1.0, relativePermeability: 1, source: '[mem] about 1.0 %IACS, recalled, not verified against a table' },
  {
    id: 'carbon-steel',
    name: 'Carbon steel (typical)',
    conductivityIacs: 10,
    relativePermeability: 100,
    source:
      '[pub] about 10 %IACS with relative permeability in the hundreds: ferromagnetic. The permeability here is an order of magnitude only; measure it or use magnetic saturation',
  },
]);
