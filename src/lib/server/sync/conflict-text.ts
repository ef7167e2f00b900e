// Plain words for the values in the conflict list and in the notes that keep a value not chosen.
const UNIT_WORDS: Record<string, string> = { Cel: '°C', '[mi_i]': 'mi', '{each}': '', 'N.m': 'N·m' };

export function describeValue(kind: string, value: Record<string, unknown>): string {
  switch (kind) {
    case 'check':
      return String(value.state ?? '').replace('_', ' ');
    case 'reading': {
      const unit = typeof value.unit === 'string' ? UNIT_WORDS[value.unit] ?? value.unit : '';
      return `${value.value ?? value.textValue ?? '—'}${unit ? ` ${unit}` : ''}`;
    }
    case 'finding':
      return [value.severity && `severity ${String(value.severity)}`, value.title && `“${String(value.title)}”`].filter(Boolean).join(', ');
    case 'note':
      return `“${String(value.body ?? '')}”`;
    case 'part_line':
      return `${value.removed ? 'removed: ' : ''}${String(value.quantity ?? '')} × ${String(value.partNumber ?? '')} ${String(value.description ?? '')}`.trim();
    case 'photo.add':
      return `photo${value.caption ? ` “${String(value.caption)}”` : ''}`;
    case 'photo.remove':
      return 'remove the photo';
    case 'sign_off':
      return `signed by ${String(value.customerName ?? 'the customer')} at ${String(value.odometer ?? '?')} on the odometer`;
    default:
      return JSON.stringify(value);
  }
}

/** What the conflict is about, for a heading: the checklist item, the finding's title, or the kind. */
export function subjectOf(kind: string, proposed: { value: Record<string, unknown> }, labels: ReadonlyMap<string, string>, entityId?: string): string {
  const itemId = typeof proposed.value.itemId === 'string' ? proposed.value.itemId : entityId;
  const label = itemId ? labels.get(itemId) : undefined;
  switch (kind) {
    case 'check':
    case 'reading':
      return label ?? (kind === 'check' ? 'Checklist item' : 'Reading');
    case 'finding':
      return typeof proposed.value.title === 'string' ? `Finding: ${proposed.value.title}` : 'Finding severity';
    case 'note':
      return 'Note';
    case 'photo.add':
    case 'photo.remove':
      return 'Photo';
    case 'part_line':
      return `Part line${typeof proposed.value.partNumber === 'string' ? ` ${proposed.value.partNumber}` : ''}`;
    case 'sign_off':
      return 'Sign-off';
    default:
      return kind;
  }
}
