// A solve failure in the sheet's own words: the solver names elements and connections by id ("src2", "c5");
// a person knows them by name ("Standby", "the connection Standby → Feeder").
export interface NamedConnection {
  from: { elementId: string };
  to: { elementId: string };
}

const escape = (id: string) => id.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

export function describeFailure(
  message: string,
  ids: readonly string[],
  names: { element: (id: string) => string | undefined; connection: (id: string) => NamedConnection | undefined },
): string {
  let out = message;
  for (const id of ids) {
    const c = names.connection(id);
    if (c) {
      const label = `the connection ${names.element(c.from.elementId) ?? c.from.elementId} → ${names.element(c.to.elementId) ?? c.to.elementId}`;
      out = out.replace(new RegExp(`\\bconnection ${escape(id)}\\b`, 'g'), label);
      continue;
    }
    const name = names.element(id);
    if (name && name !== id) out = out.replace(new RegExp(`(?<![\\w-])${escape(id)}(?![\\w-])`, 'g'), name);
  }
  return out;
}
