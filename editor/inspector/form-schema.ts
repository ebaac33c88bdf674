// The inspector form's zod schema for react-hook-form: each value must be text or a tick, and the whole form must
// pass checkForm (the quantity reader, then the element's own schema), each message under its field.
import { z } from 'zod';
import type { ElementView } from '../document/sheet-mirror';
import type { FieldDef, FieldValue } from './fields';
import { checkForm } from './form-check';

export function inspectorSchema(defs: FieldDef[], initial: Record<string, FieldValue>, element: ElementView) {
  return z.record(z.string(), z.union([z.string(), z.boolean()])).superRefine((values, ctx) => {
    const result = checkForm(defs, values, initial, element);
    if (!result.ok) for (const [key, message] of Object.entries(result.errors)) ctx.addIssue({ code: 'custom', path: [key], message });
  });
}
