// Kept free of zod so the calendar can name and colour outputs without loading the schemas.
export const outputKinds = ['fundamental', 'shg', 'opa_signal', 'opa_idler', 'dfg'] as const;
export type OutputKind = (typeof outputKinds)[number];

export const outputKindLabels: Record<OutputKind, string> = {
  fundamental: 'Fundamental',
  shg: 'SHG',
  opa_signal: 'OPA signal',
  opa_idler: 'OPA idler',
  dfg: 'DFG mid-IR',
};
