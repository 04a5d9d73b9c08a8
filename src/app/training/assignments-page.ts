import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { type ErrorStateMatcher } from '@angular/material/core';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import type { MemberDto } from '../../../shared/api/team-admin';
import { MAX_PER_TYPE, type AssignmentDto, type ScoreTableDto, type WorkStatus } from '../../../shared/api/training';
import { EXERCISE_INFO, EXERCISE_TYPES, type ExerciseType } from '../../../shared/training/exercise-types';
import { apiErrorMessage, apiFieldErrors } from '../core/api-error';
import { Auth, ROLE_LABELS } from '../core/auth';
import { TeamApi } from '../team/team-api';
import { browserTimeZone, fromLocalInput, localTimeText, localZoneText, toLocalInput } from './due-text';
import { TrainingApi } from './training-api';
import { STATUS_ICONS, STATUS_LABELS } from './work-status';

/** A due date a week from now at 16:00 local time, as a datetime-local value. */
function defaultDue(): string {
  const d = new Date(Date.now() + 7 * 86_400_000);
  d.setHours(16, 0, 0, 0);
  return toLocalInput(d.toISOString());
}

/**
 * Marks a field red exactly when the server refused it (its message is shown under it), whatever
 * the browser thinks of the value: "2.5" and "11" problems are both refused, so both are outlined.
 */
class RefusedField implements ErrorStateMatcher {
  constructor(private readonly refused: () => boolean) {}

  isErrorState(): boolean {
    return this.refused();
  }
}

/** The set with `id` ticked or not. */
function withTicked(set: ReadonlySet<number>, id: number, on: boolean): ReadonlySet<number> {
  const next = new Set(set);
  if (on) next.add(id);
  else next.delete(id);
  return next;
}

/**
 * Assignments. An apprentice sees their own with status and score. A lead or admin creates
 * assignments for chosen apprentices and reads the score table, late and missing work marked.
 */
@Component({
  selector: 'sw-assignments-page',
  imports: [FormsModule, RouterLink, MatCardModule, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './assignments-page.html',
  styleUrl: './assignments-page.scss',
})
export default class AssignmentsPage {
  private readonly api = inject(TrainingApi);
  private readonly teamApi = inject(TeamApi);
  private readonly auth = inject(Auth);

  protected readonly canAssign = computed(() => ['lead', 'admin'].includes(this.auth.user()?.role ?? ''));
  protected readonly assignments = signal<AssignmentDto[]>([]);
  protected readonly scores = signal<ScoreTableDto | null>(null);
  protected readonly apprentices = signal<MemberDto[]>([]);
  protected readonly types = EXERCISE_TYPES;
  protected readonly info = EXERCISE_INFO;
  protected readonly maxPerType = MAX_PER_TYPE;
  protected readonly statusLabels = STATUS_LABELS;
  protected readonly statusIcons = STATUS_ICONS;

  // The new-assignment form.
  protected readonly title = signal('');
  protected readonly instructions = signal('');
  protected readonly due = signal(defaultDue());
  protected readonly counts = signal<Partial<Record<ExerciseType, number>>>({ 'taper-depth': 2 });
  protected readonly chosen = signal<ReadonlySet<number>>(new Set());
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly formErrors = signal<Record<string, string>>({});
  protected readonly formMessage = signal<string | null>(null);
  protected readonly saving = signal(false);
  /** Red outlines follow the server's messages, one matcher per field. */
  protected readonly refused = {
    title: new RefusedField(() => !!this.formErrors()['title']),
    dueAt: new RefusedField(() => !!this.formErrors()['dueAt']),
    count: Object.fromEntries(EXERCISE_TYPES.map((t) => [t, new RefusedField(() => !!this.countErrors()[t])])) as Record<ExerciseType, RefusedField>,
  };

  // Moving the due date of a sent assignment.
  /** The assignment whose due date is being changed, if any. */
  protected readonly editingDue = signal<number | null>(null);
  protected readonly newDue = signal('');
  protected readonly dueError = signal<string | null>(null);
  protected readonly listMessage = signal<string | null>(null);
  protected readonly dueRefused = new RefusedField(() => !!this.dueError());
  /** A stored time on this browser's clock, with the zone named. */
  protected readonly time = (iso: string) => localTimeText(iso);
  /** The same, short, for the score table's column heads (the zone is named once, in the caption). */
  protected readonly shortTime = (iso: string) => localTimeText(iso, { short: true });
  protected readonly zone = (iso: string) => localZoneText(iso);

  constructor() {
    void this.load();
  }

  /** The status label of a work status. */
  protected label(status: WorkStatus): string {
    return STATUS_LABELS[status];
  }

  /** The exercise types in the order the last request listed them (the API names its errors by position). */
  private sentTypes: ExerciseType[] = [];
  /** The API's message for each exercise type's count (`items.<n>.count`), shown under its box. */
  protected readonly countErrors = computed(() => {
    const out: Partial<Record<ExerciseType, string>> = {};
    for (const [key, message] of Object.entries(this.formErrors())) {
      const m = /^items\.(\d+)\.count$/.exec(key);
      const type = m ? this.sentTypes[Number(m[1])] : undefined;
      if (type) out[type] = message;
    }
    return out;
  });

  protected setCount(type: ExerciseType, value: string | number): void {
    // As typed: a fraction or too many is refused with its reason on sending, never quietly changed.
    const n = Number(value) || 0;
    this.counts.update((c) => ({ ...c, [type]: n }));
  }

  protected toggle(id: number, on: boolean): void {
    this.chosen.update((set) => withTicked(set, id, on));
  }

  /** Sends the new assignment; each chosen apprentice gets their own problems and an e-mail. */
  protected async create(): Promise<void> {
    this.saving.set(true);
    this.formErrors.set({});
    this.formMessage.set(null);
    const items = EXERCISE_TYPES.filter((t) => (this.counts()[t] ?? 0) !== 0).map((type) => ({ type, count: this.counts()[type] ?? 0 }));
    this.sentTypes = items.map((i) => i.type);
    try {
      const created = await firstValueFrom(this.api.create({
        title: this.title(),
        instructions: this.instructions(),
        items,
        dueAt: fromLocalInput(this.due()),
        // The e-mail gives the due time on this clock, with the zone named.
        timeZone: browserTimeZone(),
        assigneeIds: [...this.chosen()],
      }));
      this.formMessage.set(`Assigned "${created.title}" to ${created.work.length} apprentice${created.work.length === 1 ? '' : 's'}; ${created.mailSent} e-mail notice${created.mailSent === 1 ? '' : 's'} sent.`);
      this.title.set('');
      this.instructions.set('');
      this.chosen.set(new Set());
      await this.load();
    } catch (err) {
      this.formErrors.set(apiFieldErrors(err));
      this.formMessage.set(apiErrorMessage(err));
    } finally {
      this.saving.set(false);
    }
  }

  /** Opens the due-date box of a sent assignment, on this browser's clock. */
  protected editDue(a: AssignmentDto): void {
    this.editingDue.set(a.id);
    this.newDue.set(toLocalInput(a.dueAt));
    this.dueError.set(null);
    this.listMessage.set(null);
  }

  protected cancelDue(): void {
    this.editingDue.set(null);
    this.dueError.set(null);
  }

  /** Moves the due date; apprentices who have not finished get an e-mail with the new time. */
  protected async saveDue(a: AssignmentDto): Promise<void> {
    this.dueError.set(null);
    try {
      const changed = await firstValueFrom(this.api.changeDue(a.id, { dueAt: fromLocalInput(this.newDue()), timeZone: browserTimeZone() }));
      this.editingDue.set(null);
      this.listMessage.set(
        `"${changed.title}" is now due ${this.time(changed.dueAt)}; ${changed.mailSent} e-mail notice${changed.mailSent === 1 ? '' : 's'} sent to apprentices who have not finished.`,
      );
      await this.load();
    } catch (err) {
      this.dueError.set(apiFieldErrors(err)['dueAt'] ?? apiErrorMessage(err));
    }
  }

  /** The assignment whose "add apprentices" box is open, and who is ticked in it. */
  protected readonly addingTo = signal<number | null>(null);
  protected readonly addChosen = signal<ReadonlySet<number>>(new Set());
  protected readonly addError = signal<string | null>(null);

  /** Active apprentices of the team who do not have the assignment yet. */
  protected notGiven(a: AssignmentDto): MemberDto[] {
    const given = new Set(a.work.map((w) => w.userId));
    return this.apprentices().filter((m) => !given.has(m.id));
  }

  protected openAdd(a: AssignmentDto): void {
    this.addingTo.set(a.id);
    this.addChosen.set(new Set());
    this.addError.set(null);
    this.listMessage.set(null);
  }

  protected cancelAdd(): void {
    this.addingTo.set(null);
    this.addError.set(null);
  }

  protected toggleAdd(id: number, on: boolean): void {
    this.addChosen.update((set) => withTicked(set, id, on));
  }

  /** Gives the assignment to the ticked apprentices: each gets problems of their own and an e-mail. */
  protected async saveAdd(a: AssignmentDto): Promise<void> {
    this.addError.set(null);
    const ids = [...this.addChosen()];
    if (!ids.length) {
      this.addError.set('Tick at least one apprentice to give it to.');
      return;
    }
    try {
      const changed = await firstValueFrom(this.api.addAssignees(a.id, { assigneeIds: ids, timeZone: browserTimeZone() }));
      this.addingTo.set(null);
      const names = this.apprentices().filter((m) => ids.includes(m.id)).map((m) => m.name);
      this.listMessage.set(`"${changed.title}" given to ${names.join(', ')}; ${changed.mailSent} e-mail notice${changed.mailSent === 1 ? '' : 's'} sent.`);
      await this.load();
    } catch (err) {
      this.addError.set(apiFieldErrors(err)['assigneeIds'] ?? apiErrorMessage(err));
      // Someone else may have added an apprentice meanwhile: show the list as it is now.
      await this.load();
    }
  }

  /** Deletes an assignment after asking. */
  protected async remove(a: AssignmentDto): Promise<void> {
    if (!confirm(`Delete "${a.title}" and every apprentice's work on it?`)) return;
    await firstValueFrom(this.api.remove(a.id));
    await this.load();
  }

  private async load(): Promise<void> {
    await this.auth.ready();
    this.assignments.set(await firstValueFrom(this.api.assignments()));
    if (this.canAssign()) {
      this.scores.set(await firstValueFrom(this.api.scores()));
      const members = await firstValueFrom(this.teamApi.members());
      this.apprentices.set(members.filter((m) => m.role === 'apprentice' && m.active));
    }
  }
}
