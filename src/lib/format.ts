import type { ProjectKind, Role } from '../../shared/contracts';

const roleLabels: Record<Role, string> = {
  admin: 'Administrator',
  engineer: 'Engineer',
  owner: 'Owner',
  fabricator: 'Fabricator',
  viewer: 'Viewer',
};

const roleDuties: Record<Role, string> = {
  admin: "Manages the organisation's people and their roles",
  engineer: 'Creates and changes projects and their designs',
  owner: 'Reads the comfort criteria and the design, and approves or returns them',
  fabricator: 'Reads the released hardware sheet and records as-built data',
  viewer: 'Reads everything in a project, changes nothing',
};

const kindLabels: Record<ProjectKind, string> = {
  footbridge: 'Footbridge',
  floor: 'Floor',
};

export function formatRole(role: Role): string {
  return roleLabels[role];
}

export function describeRole(role: Role): string {
  return roleDuties[role];
}

export function formatProjectKind(kind: ProjectKind): string {
  return kindLabels[kind];
}

const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
const dateTimeFormat = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
});

/** "3 Dec 2026" from an ISO timestamp; an unreadable value is shown as it came. */
export function formatDate(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : dateFormat.format(date);
}

/** "3 Dec 2026, 14:05" from an ISO timestamp. */
export function formatDateTime(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : dateTimeFormat.format(date);
}

const significantFormats = new Map<number, Intl.NumberFormat>();

/** A number to `significant` significant digits, grouped in thousands ("45,000", "1.873", "0.00512"). */
export function formatNumber(value: number, significant = 4): string {
  if (!Number.isFinite(value)) return value > 0 ? '∞' : value < 0 ? '−∞' : '—';
  const magnitude = Math.abs(value);
  if (magnitude !== 0 && (magnitude < 1e-4 || magnitude >= 1e7)) return formatPowerOfTen(value, significant);
  let format = significantFormats.get(significant);
  if (!format) {
    format = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: significant });
    significantFormats.set(significant, format);
  }
  return format.format(value).replace('-', '−');
}

const superscripts: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

/** 3.2e9 → "3.2 × 10⁹" (trailing zeros of the mantissa dropped). */
function formatPowerOfTen(value: number, significant: number): string {
  const [mantissa, exponent] = value.toExponential(significant - 1).split('e');
  const digits = String(Number(exponent)).replace(/./g, (char) => superscripts[char] ?? char);
  return `${String(Number(mantissa)).replace('-', '−')} × 10${digits}`;
}

/** A change or deviation with its sign shown both ways: "+10.4", "−3.2", "0". */
export function formatSignedNumber(value: number, significant = 4): string {
  const text = formatNumber(value, significant);
  return value > 0 ? `+${text}` : text;
}

/** A number with its SI unit: "1.873 Hz", "45,000 kg". */
export function formatQuantity(value: number, unit: string, significant = 4): string {
  return `${formatNumber(value, significant)} ${unit}`;
}

/** A ratio as a percentage: 0.006 → "0.6 %". */
export function formatPercent(ratio: number, significant = 3): string {
  return `${formatNumber(ratio * 100, significant)} %`;
}
