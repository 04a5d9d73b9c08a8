import type { Transaction } from 'sequelize';
import type { FieldChange, RevisionAction, SetupCheck } from '../../shared/api/setup';
import type { Setup } from '../models/setup';
import { SetupRevision } from '../models/setup-revision';
import type { User } from '../models/user';

/** The editable content of a set-up, as stored in each revision. */
export interface SetupContent {
  name: string;
  kind: string;
  inputs: Record<string, unknown>;
  notes: string;
  job: string | null;
  checks: SetupCheck[];
}

/** The content of a set-up now. */
export function contentOf(setup: Setup): SetupContent {
  return { name: setup.name, kind: setup.kind, inputs: setup.inputs, notes: setup.notes, job: setup.job ?? null, checks: setup.checks ?? [] };
}

const MAX_SHOWN = 200;

function shown(value: unknown): string {
  if (value === undefined || value === null) return '';
  const text = typeof value === 'string' ? value : JSON.stringify(value);
  return text.length > MAX_SHOWN ? `${text.slice(0, MAX_SHOWN - 1)}…` : text;
}

/**
 * What changed between two contents, field by field; the inputs are compared key by key
 * ("inputs.angle") so the history says which input was changed.
 */
export function diffContent(before: SetupContent, after: SetupContent): FieldChange[] {
  const changes: FieldChange[] = [];
  for (const field of ['name', 'kind', 'notes', 'job'] as const) {
    if ((before[field] ?? '') !== (after[field] ?? '')) changes.push({ field, from: shown(before[field]), to: shown(after[field]) });
  }
  const keys = [...new Set([...Object.keys(before.inputs), ...Object.keys(after.inputs)])].sort();
  for (const key of keys) {
    const a = JSON.stringify(before.inputs[key] ?? null);
    const b = JSON.stringify(after.inputs[key] ?? null);
    if (a !== b) changes.push({ field: `inputs.${key}`, from: shown(before.inputs[key]), to: shown(after.inputs[key]) });
  }
  if (JSON.stringify(before.checks) !== JSON.stringify(after.checks)) {
    // Each check with its nominal and tolerance, so a changed tolerance shows as a change.
    const text = (list: SetupCheck[]) => list.map((c) => `${c.label} ${c.nominal} ${c.unit} +${c.plus}/-${c.minus}`).join('; ');
    changes.push({ field: 'checks', from: shown(text(before.checks)), to: shown(text(after.checks)) });
  }
  return changes;
}

/** Stores one revision of a set-up (inside the caller's transaction); `at` dates it (the demo seed), else now. */
export async function recordRevision(setup: Setup, action: RevisionAction, user: User | null, changes: FieldChange[], transaction?: Transaction, at?: Date): Promise<SetupRevision> {
  return SetupRevision.create(
    { setupId: setup.id, version: setup.version, action, status: setup.status, userId: user?.id ?? null, changes, snapshot: { ...contentOf(setup), status: setup.status }, ...(at ? { createdAt: at } : {}) },
    { transaction },
  );
}
