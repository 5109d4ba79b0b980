/**
 * Plain words for a history entry: "Ana Engineer changed the load case “Crowd class II”" and one line per changed
 * value ("density: 0.5 → 0.8 persons/m²"). Nested values (a load case's spec) are compared leaf by leaf; units come
 * from the field name's suffix (the API's names carry them: `frequencyHz`, `modalMassKg`, `densityPerM2`). Values are
 * shown as stored, in SI.
 */
import type { HistoryChange, HistoryEvent } from '../../../../shared/contracts/history';
import { formatNumber, formatQuantity } from '../../../lib/format';

const entityNouns: Record<string, string> = {
  structure: 'structure',
  mode: 'mode',
  'lumped-model': 'lumped model',
  'load-case': 'load case',
  'comfort-criteria': 'comfort criteria',
  'tuning-variant': 'tuning variant',
  'sign-off': 'design',
  'site-record': 'site record',
  'as-built-record': 'as-built record',
};

/** What a kind of thing is called in a sentence; a kind added later reads from its name. */
export function entityNoun(entity: string): string {
  return entityNouns[entity] ?? entity.replace(/-/g, ' ');
}

/** What happened, as a verb in the past (the filter's choices read the same). */
export const actionVerbs: Record<string, string> = {
  create: 'added',
  update: 'changed',
  delete: 'deleted',
  submitted: 'submitted for sign-off',
  approved: 'approved',
  returned: 'returned',
};

export function actorName(event: HistoryEvent): string {
  if (!event.by) return 'Set-up or script (no person)';
  return event.by.name || event.by.email || 'A former member';
}

/** "changed the load case “Crowd class II”"; a sign-off names the design (its tuning variant). */
export function eventSentence(event: HistoryEvent): string {
  const verb = actionVerbs[event.action] ?? event.action;
  const label = event.label ? ` “${event.label}”` : '';
  if (event.entity === 'sign-off') {
    if (event.action === 'submitted') return `submitted the design${label} for sign-off`;
    if (event.action === 'delete') return `deleted the sign-off of the design${label}`;
    return `${verb} the design${label}`;
  }
  return `${verb} the ${entityNoun(event.entity)}${label}`;
}

/** Unit suffixes of field names, longest first; the words before the suffix name the quantity. */
const unitSuffixes: [RegExp, string][] = [
  [/PersonsPerM2$|PerM2$/, 'persons/m²'],
  [/MPerS2$/, 'm/s²'],
  [/NPerM$/, 'N/m'],
  [/NsPerM$/, 'N·s/m'],
  [/Hz$/, 'Hz'],
  [/Kg$/, 'kg'],
  [/M2$/, 'm²'],
  [/Mm$/, 'mm'],
  [/M$/, 'm'],
  [/N$/, 'N'],
  [/S$/, 's'],
];

/** Names that read better than their words: ids name the thing they point at. */
const fieldNameOverrides: Record<string, string> = { loadCaseIds: 'load cases', modeId: 'mode', criteriaId: 'comfort criteria', variantId: 'tuning variant', structureId: 'structure' };

/** `deckAreaM2` → { words: "deck area", unit: "m²" }; `dampingRatio` → { words: "damping ratio" }. */
export function fieldWords(field: string): { words: string; unit?: string } {
  let name = field;
  let unit: string | undefined;
  for (const [pattern, label] of unitSuffixes) {
    if (pattern.test(name) && name.replace(pattern, '').length > 0) {
      name = name.replace(pattern, '');
      unit = label;
      break;
    }
  }
  const words = fieldNameOverrides[field] ?? name.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();
  return { words, unit };
}

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** Leaves of nested objects by dotted path (arrays are leaves). */
function leaves(value: unknown, prefix: string, out: Map<string, unknown>): Map<string, unknown> {
  if (isPlainObject(value)) for (const [key, inner] of Object.entries(value)) leaves(inner, prefix ? `${prefix}.${key}` : key, out);
  else out.set(prefix, value);
  return out;
}

export function formatValue(value: unknown, unit: string | undefined, names: Record<string, string>): string {
  if (value === null || value === undefined) return 'none';
  if (typeof value === 'number') return unit ? formatQuantity(value, unit) : formatNumber(value);
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'string') {
    if (names[value]) return `“${names[value]}”`;
    if (/^[0-9a-f]{8}-[0-9a-f]{4}-/i.test(value)) return 'a thing since deleted';
    return `“${value}”`;
  }
  if (Array.isArray(value)) {
    if (value.length > 0 && value.every(Array.isArray)) return `a ${value.length} × ${(value[0] as unknown[]).length} matrix`;
    if (value.length === 0) return 'none';
    return value.map((item) => formatValue(item, unit, names)).join(', ');
  }
  return JSON.stringify(value);
}

export interface ChangeLine {
  /** "density", "spec kind", "load cases". */
  what: string;
  /** "0.5 persons/m²", absent on a create. */
  before?: string;
  after?: string;
  /** A large value that is not copied into the history. */
  hiddenValue?: boolean;
}

/** One line per value that changed (per leaf of a nested value). */
export function changeLines(change: HistoryChange, field: string, names: Record<string, string>): ChangeLine[] {
  if (change.changed) return [{ what: fieldWords(field).words, hiddenValue: true }];
  const nested = isPlainObject(change.before) || isPlainObject(change.after);
  if (!nested) {
    const { words, unit } = fieldWords(field);
    return [
      {
        what: words,
        ...('before' in change ? { before: formatValue(change.before, unit, names) } : {}),
        ...('after' in change ? { after: formatValue(change.after, unit, names) } : {}),
      },
    ];
  }
  const before = 'before' in change ? leaves(change.before, '', new Map()) : undefined;
  const after = 'after' in change ? leaves(change.after, '', new Map()) : undefined;
  const paths = [...new Set([...(before?.keys() ?? []), ...(after?.keys() ?? [])])];
  const lines: ChangeLine[] = [];
  for (const path of paths) {
    const b = before?.get(path);
    const a = after?.get(path);
    if (before && after && JSON.stringify(a) === JSON.stringify(b)) continue;
    const last = path.split('.').pop() ?? path;
    const { words, unit } = fieldWords(last);
    const parents = path.split('.').slice(0, -1).map((p) => fieldWords(p).words);
    lines.push({
      what: [...parents, words].join(' '),
      ...(before ? { before: formatValue(b, unit, names) } : {}),
      ...(after ? { after: formatValue(a, unit, names) } : {}),
    });
  }
  return lines;
}

/** Every line of the entry, in the order the fields came. */
export function eventLines(event: HistoryEvent, names: Record<string, string>): ChangeLine[] {
  return Object.entries(event.changes).flatMap(([field, change]) => changeLines(change, field, names));
}
