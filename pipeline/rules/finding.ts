// Build a finding from a rule's template. Findings are data; `message` is the template filled in.
import type { Diagnosis, Finding, Location, Rule, Severity } from '../types.js';

/** Fill `{name}` placeholders; numbers are shown with up to 4 significant decimals, never in exponent form for ordinary sizes. */
export function renderTemplate(template: string, params: Record<string, number | string>): string {
  return template.replace(/\{(\w+)\}/g, (_, k: string) => {
    const v = params[k];
    if (v === undefined) return `{${k}}`;
    return typeof v === 'number' ? formatNumber(v) : v;
  });
}

export function formatNumber(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  const a = Math.abs(v);
  if (a !== 0 && (a < 1e-3 || a >= 1e7)) return v.toExponential(3);
  return String(Number(v.toPrecision(6)));
}

export interface FindingExtra {
  species?: string;
  phase?: string;
  diagnosis?: Diagnosis;
  severity?: Severity;
}

/** Each rule's message templates by rule id, as makeFinding meets them: a finding store renders messages again from them. */
const templates = new Map<string, Record<string, string>>();

/** The template of a rule's message, as makeFinding last used it; undefined when it has not made one. */
export function templateOf(rule: string, messageId: string): string | undefined {
  return templates.get(rule)?.[messageId];
}

export function makeFinding(
  rule: Rule,
  messageId: string,
  params: Record<string, number | string>,
  location: Location,
  extra: FindingExtra = {},
): Finding {
  const template = rule.messages[messageId];
  if (template === undefined) throw new Error(`internal: rule ${rule.id} has no message ${messageId}`);
  if (templates.get(rule.id) !== rule.messages) templates.set(rule.id, rule.messages);
  const f: Finding = {
    rule: rule.id,
    severity: extra.severity ?? rule.severity,
    messageId,
    params,
    message: renderTemplate(template, params),
    location,
  };
  if (extra.species !== undefined) f.species = extra.species;
  if (extra.phase !== undefined) f.phase = extra.phase;
  if (extra.diagnosis) f.diagnosis = extra.diagnosis;
  return f;
}
