// A rule's basis in plain statements. The engine tags each part of a basis with
// where it comes from: "[pub]" a published source, "[trade]" common practice,
// "[mem]" a value recalled and not yet checked against the published text, and
// "product default" a setting Whorl starts with. People read statements, never tags.
import { POLICY_SETTINGS } from '../domain/policy';

export type BasisKind = 'published' | 'trade' | 'recalled' | 'default' | 'plain';

export interface BasisStatement {
  kind: BasisKind;
  /** The statement in words, e.g. "Published: ASTM E1004 §1.4". */
  text: string;
}

export const BASIS_KIND_LABELS: Record<BasisKind, string> = {
  published: 'Published',
  trade: 'Common practice, no single source',
  recalled: 'Recalled, not yet checked against the published text',
  default: 'Organisation default; confirm against your applicable standard',
  plain: '',
};

const TAGS: [RegExp, BasisKind][] = [
  [/^\[pub\]\s*/i, 'published'],
  [/^\[trade\]\s*/i, 'trade'],
  [/^\[mem\]\s*/i, 'recalled'],
];

const DEFAULT_MARK = /\b(?:whorl )?product default\b/i;
const TRADE_MARK = /,?\s*common practice, no single source/i;
// Untagged forms the policy settings use for their defaults.
const UNTAGGED: [RegExp, BasisKind][] = [
  [/^\s*from memory\s*[:,]?\s*/i, 'recalled'],
  [/^\s*common practice, no single source\s*/i, 'trade'],
  [/^\s*(?:whorl )?product default(?:, no published source)?\s*/i, 'default'],
];
const NOT_VERIFIED = /,?\s*\(?\s*not verified against (?:the text|a table)\)?/i;

const POLICY_LABELS = new Map<string, string>(POLICY_SETTINGS.map((setting) => [setting.key, setting.label]));

/** "policy scanIndexFractionMax" → the setting's name, as the policy page shows it. */
const policyNamesInWords = (text: string) =>
  text
    .replace(/\b([a-z][a-zA-Z]+)Min\/Max\b/g, '$1Min / $1Max')
    .replace(/\b(?:policy )?([a-z][a-zA-Z]+)\b/g, (whole, key: string) => {
      const label = POLICY_LABELS.get(key);
      return label ? `the policy setting “${label[0].toLowerCase()}${label.slice(1)}”` : whole;
    })
    .replace(/\b(?:Whorl )?product default\b/gi, 'default');

function statement(kind: BasisKind, detail: string): BasisStatement {
  const label = BASIS_KIND_LABELS[kind];
  const clean = detail.replace(/\s+/g, ' ').trim();
  if (kind === 'plain') return { kind, text: clean ? clean[0].toUpperCase() + clean.slice(1) : clean };
  return { kind, text: clean ? `${label}: ${clean}` : label };
}

/**
 * Splits a tagged basis into statements: "[pub] δ = …; [trade] k = 3" becomes
 * "Published: δ = …" and "Common practice, no single source: k = 3". A part
 * that rests on a product default gets the organisation-default statement too.
 */
export function basisStatements(basis: string | null | undefined): BasisStatement[] {
  if (!basis?.trim()) return [];
  // Split only where a new tag starts, so "; " inside a statement stays.
  const parts = basis.split(/;\s*(?=\[(?:pub|trade|mem)\])/i);
  const statements: BasisStatement[] = [];
  for (const raw of parts) {
    let part = raw.trim();
    let kind: BasisKind = 'plain';
    for (const [tag, tagKind] of TAGS) {
      if (tag.test(part)) {
        kind = tagKind;
        part = part.replace(tag, '');
        break;
      }
    }
    if (kind === 'plain') {
      for (const [mark, markKind] of UNTAGGED) {
        if (mark.test(part)) {
          kind = markKind;
          part = part.replace(mark, '');
          break;
        }
      }
    }
    if (kind === 'trade') part = part.replace(TRADE_MARK, '');
    if (kind === 'recalled') part = part.replace(NOT_VERIFIED, '').replace(/,?\s*recalled\b,?/i, '');
    part = policyNamesInWords(part).trim().replace(/^\((.*)\)$/, '$1').replace(/^[\s,;:]+|[\s,;:]+$/g, '');
    statements.push(statement(kind, part));
    if (DEFAULT_MARK.test(raw) && kind !== 'default') statements.push(statement('default', ''));
  }
  // The same statement twice (two parts resting on defaults) reads as one.
  return statements.filter((item, index) => statements.findIndex((other) => other.text === item.text) === index);
}

/** The basis as one line of plain statements, for PDFs, e-mails and exports. */
export function basisInWords(basis: string | null | undefined): string {
  return basisStatements(basis)
    .map((item) => item.text)
    .join('. ')
    .replace(/\.\./g, '.');
}
