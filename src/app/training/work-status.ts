import type { WorkStatus } from '../../../shared/api/training';

/** How each work status reads on screen. */
export const STATUS_LABELS: Readonly<Record<WorkStatus, string>> = {
  'not-started': 'Not started',
  'in-progress': 'In progress',
  done: 'Done',
  late: 'Done late',
  missing: 'Missing (overdue)',
};

/** The Material icon of each work status. */
export const STATUS_ICONS: Readonly<Record<WorkStatus, string>> = {
  'not-started': 'radio_button_unchecked',
  'in-progress': 'pending',
  done: 'check_circle',
  late: 'schedule',
  missing: 'error',
};
