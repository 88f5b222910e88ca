// A waiver past its expiry date no longer waives anything, and is itself an error until renewed or removed.
import type { Rule } from '../types.js';

export const rule: Rule = {
  id: 'waiver-expired',
  severity: 'error',
  docs: 'docs/rules/waiver-expired.md',
  description: 'A waiver whose expiry date has passed: it waives nothing, and the run fails until it is renewed or removed.',
  messages: {
    expired: 'waiver for {rule} on {target} expired on {expires} (accepted by {by}); the findings it covered count again',
  },
};
