import {
  type EntryFigure,
  FIGURE_COLUMNS,
  LIBRARY_COLLECTION,
  type LibraryKind,
  PROPERTY_SOURCE_LABELS,
  type PropertyValue,
  REVISION_STATE_LABELS,
  type RevisionState,
  WEB_KIND_LABELS,
  type WebKind,
  formatQuantity,
} from 'wick-core';

export const KIND_LABELS: Readonly<Record<LibraryKind, { one: string; many: string }>> = {
  fibre: { one: 'fibre', many: 'Fibres' },
  web: { one: 'web', many: 'Webs' },
  liquid: { one: 'liquid', many: 'Liquids' },
};

/** The UI address of an entry (the server's e-mail links use the same paths). */
export function entryLink(kind: LibraryKind, id: number): string[] {
  return kind === 'liquid' ? ['/liquids', String(id)] : ['/materials', LIBRARY_COLLECTION[kind], String(id)];
}

/** The list a kind lives in. */
export function listLink(kind: LibraryKind): string[] {
  return kind === 'liquid' ? ['/liquids'] : ['/materials', LIBRARY_COLLECTION[kind]];
}

export function kindOfCollection(collection: string | null | undefined): LibraryKind | null {
  const hit = (Object.entries(LIBRARY_COLLECTION) as [LibraryKind, string][]).find(([, c]) => c === collection);
  return hit ? hit[0] : null;
}

/** "0.045 kg/m²" typed as g/m² reads "45 g/m²"; uncertainty as "± 2 g/m²". */
export function formatValue(si: number, unit: string, digits = 4): string {
  try {
    return formatQuantity(si, unit, digits);
  } catch {
    return `${si} (${unit})`;
  }
}

export function formatProperty(p: PropertyValue | undefined | null): string {
  if (!p) return '—';
  const main = formatValue(p.si, p.unit);
  return p.uncertainty !== undefined ? `${main} ± ${formatValue(p.uncertainty, p.unit, 2)}` : main;
}

export function sourceLabel(p: PropertyValue | undefined | null): string {
  return p ? PROPERTY_SOURCE_LABELS[p.source] : '';
}

export function stateLabel(state: RevisionState): string {
  return REVISION_STATE_LABELS[state];
}

export function figureText(kind: LibraryKind, key: string, figure: EntryFigure | undefined): string {
  if (!figure) return '—';
  if ('text' in figure) return key === 'webKind' ? (WEB_KIND_LABELS[figure.text as WebKind] ?? figure.text) : figure.text;
  const column = FIGURE_COLUMNS[kind].find((c) => c.key === key);
  return formatValue(figure.si, figure.unit, column?.dimension === 'fraction' ? 3 : 4);
}

/** ISO date-time → "2 Dec 2026, 14:05" in the person's locale. */
export function when(iso: string | null | undefined): string {
  if (!iso) return '';
  return new Date(iso).toLocaleString(undefined, { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
}
