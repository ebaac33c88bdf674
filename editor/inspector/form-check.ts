// Checks an inspector form before anything is written: every number through the quantity reader, then the whole
// element through its schema, with each message placed under the field it is about. Returns the writes of the
// fields that changed (one command, one undo step) or the messages.
import { elementSchema } from '../../shared/sheet';
import type { ElementView } from '../document/sheet-mirror';
import type { Plain } from '../document/y-values';
import { setAtPath } from './plain-path';
import { parseQuantity } from '../quantity/parse-quantity';
import { pathsOf, writesOf, type FieldDef, type FieldValue, type Write } from './fields';

export type FormCheck = { ok: true; writes: Write[] } | { ok: false; errors: Record<string, string> };

function labelled(message: string, field: string, label: string): string {
  // Schema messages start with the format's field name ("kva must be …"); say the label instead.
  return message.startsWith(field) ? `${label}${message.slice(field.length)}` : message;
}

export function checkForm(defs: FieldDef[], values: Record<string, FieldValue>, initial: Record<string, FieldValue>, element: ElementView): FormCheck {
  const errors: Record<string, string> = {};
  const writes: Write[] = [];
  const visible = defs.filter((d) => !d.visible || d.visible(values));
  for (const d of visible) {
    const value = values[d.key];
    if (value === initial[d.key]) continue;
    if (d.type === 'quantity') {
      const text = String(value ?? '').trim();
      if (text === '' && d.optional) {
        writes.push(...writesOf(d, undefined, element));
        continue;
      }
      const parsed = parseQuantity(text, d.unit);
      if (!parsed.ok) {
        errors[d.key] = parsed.message;
        continue;
      }
      if (d.integer && !Number.isInteger(parsed.value)) {
        errors[d.key] = `${d.label} must be a whole number`;
        continue;
      }
      writes.push(...writesOf(d, parsed.value, element));
    } else if (d.type === 'text') {
      writes.push(...writesOf(d, String(value ?? '').trim(), element));
    } else {
      writes.push(...writesOf(d, value, element));
    }
  }
  if (Object.keys(errors).length) return { ok: false, errors };
  // The element as it would be: checked whole, so rules across fields (a fault current for that strength) hold.
  const candidate = JSON.parse(JSON.stringify(element)) as Record<string, Plain>;
  for (const w of writes) setAtPath(candidate, w.path, w.value);
  const parsed = elementSchema.safeParse(candidate);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const path = issue.path.map(String);
      const d = visible.find((f) => pathsOf(f).some((p) => p.every((k, i) => path[i] === k))) ?? visible.find((f) => f.key === 'name')!;
      if (!errors[d.key]) errors[d.key] = labelled(issue.message, path[path.length - 1] ?? '', d.label);
    }
    return { ok: false, errors };
  }
  return { ok: true, writes };
}
