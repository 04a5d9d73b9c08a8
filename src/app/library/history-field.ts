import { labelOf } from '../../../shared/forms/form-text';

/**
 * The words a set-up's history uses for a changed field: the stored names ("inputs.taperLength",
 * "attachments") are the program's. An input is named as the set-up's list of inputs names it.
 */
const WORDS: Readonly<Record<string, string>> = {
  name: 'Name',
  kind: 'Kind',
  notes: 'Notes',
  job: 'Job',
  checks: 'Checks',
  status: 'Status',
  attachments: 'Files',
};

/** The words for one changed field of a set-up's history. */
export function historyFieldLabel(field: string): string {
  return WORDS[field] ?? labelOf(field.startsWith('inputs.') ? field.slice('inputs.'.length) : field);
}
