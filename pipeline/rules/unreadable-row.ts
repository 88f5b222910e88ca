// A row that cannot be read as a record of the table: wrong number of fields, invalid JSON, a value of the wrong type.
import type { Rule } from '../types.js';

export const rule: Rule = {
  id: 'unreadable-row',
  severity: 'error',
  docs: 'docs/rules/unreadable-row.md',
  description: 'A row that cannot be read as a record of the table: wrong number of fields, invalid JSON, a value of the wrong type.',
  messages: {
    ragged: 'row has {found} fields, the header has {expected}: it ends before column {column} ({field})',
    raggedLong: 'row has {found} fields, the header has {expected}: column {column} onwards lies beyond the header',
    json: 'record is not valid JSON: {detail}',
    notObject: 'record is {detail}, not an object of column values',
    type: 'field {field} holds {detail}; expected {expected}',
  },
};
