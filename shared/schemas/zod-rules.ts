/** Builds the API's zod fields from the shared rules (./rules.ts), so the contract and the forms agree. */
import { z } from 'zod';
import { CONTROL_MESSAGE, LINE_BREAK_MESSAGE, textLinesProblem, textPrintProblem, type NumberRule, type TextRule } from './rules';

/** A string field: trimmed and re-cased as the rule says, then checked in the rule's order. */
export function zodText(rule: TextRule) {
  let s = z.string({ message: rule.required ?? 'Enter text here.' });
  if (rule.trim) s = s.trim();
  if (rule.letterCase === 'lower') s = s.toLowerCase();
  if (rule.letterCase === 'upper') s = s.toUpperCase();
  if (rule.required) s = s.min(1, rule.required);
  if (rule.minLength) s = s.min(rule.minLength.value, rule.minLength.message);
  s = s.max(rule.maxLength.value, rule.maxLength.message);
  if (rule.pattern) s = s.regex(rule.pattern.re, rule.pattern.message);
  if (rule.lines) {
    s = s
      .refine((v) => textLinesProblem(rule, v) !== LINE_BREAK_MESSAGE, LINE_BREAK_MESSAGE)
      .refine((v) => textLinesProblem(rule, v) !== CONTROL_MESSAGE, CONTROL_MESSAGE);
  }
  if (rule.printable) {
    s = s.superRefine((v, ctx) => {
      const message = textPrintProblem(rule, v);
      if (message) ctx.addIssue({ code: 'custom', message });
    });
  }
  return s;
}

/** A number field; a missing, non-numeric or infinite value gets the rule's `required` sentence. */
export function zodNumber(rule: NumberRule) {
  let n = z.number({ message: rule.required });
  if (rule.integer) n = n.int(rule.integer);
  if (rule.min) n = n.min(rule.min.value, rule.min.message);
  if (rule.above) n = n.gt(rule.above.value, rule.above.message);
  if (rule.max) n = n.max(rule.max.value, rule.max.message);
  return n;
}
