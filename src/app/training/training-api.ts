import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import type { AssignmentAddBody, AssignmentCreateBody, AssignmentDto, AssignmentDueBody, AttemptResultDto, GradeBody, ProblemDto, ReviewProblemDto, ScoreTableDto, WorkReviewDto } from '../../../shared/api/training';
import { quietErrors } from '../core/api-error';

/** One apprentice's copy of an assignment: the assignment and their problems. */
export interface AssignmentWorkView {
  assignment: AssignmentDto;
  problems: ProblemDto[];
}

/** Training over HTTP: assignments, the caller's own work, and the lead's score table. */
@Injectable({ providedIn: 'root' })
export class TrainingApi {
  private readonly http = inject(HttpClient);

  /** Leads and admins: the team's assignments; anyone else: the ones given to them. */
  assignments(): Observable<AssignmentDto[]> {
    return this.http.get<{ assignments: AssignmentDto[] }>('/api/training/assignments').pipe(map((r) => r.assignments));
  }

  /** Creates an assignment (leads and admins); field errors come back as a 400 for the form. */
  create(body: AssignmentCreateBody): Observable<AssignmentDto & { mailSent: number }> {
    return this.http.post<AssignmentDto & { mailSent: number }>('/api/training/assignments', body, { context: quietErrors() });
  }

  /** Moves an assignment's due date (leads and admins); a refusal comes back as a 400 for the form. */
  changeDue(id: number, body: AssignmentDueBody): Observable<AssignmentDto & { mailSent: number }> {
    return this.http.patch<AssignmentDto & { mailSent: number }>(`/api/training/assignments/${id}`, body, { context: quietErrors() });
  }

  /** Gives an assignment to more apprentices (leads and admins); a refusal comes back for the form. */
  addAssignees(id: number, body: AssignmentAddBody): Observable<AssignmentDto & { mailSent: number }> {
    return this.http.post<AssignmentDto & { mailSent: number }>(`/api/training/assignments/${id}/assignees`, body, { context: quietErrors() });
  }

  /** Grades a closed problem of an apprentice's work by hand (leads and admins); a refusal comes back for the form. */
  grade(id: string | number, userId: string | number, position: number, body: GradeBody): Observable<ReviewProblemDto> {
    return this.http.post<ReviewProblemDto>(`/api/training/assignments/${id}/work/${userId}/problems/${position}/grade`, body, { context: quietErrors() });
  }

  /** Deletes an assignment and its work. */
  remove(id: number): Observable<void> {
    return this.http.delete<void>(`/api/training/assignments/${id}`);
  }

  /** The caller's own problems of an assignment; the page shows a refusal (withdrawn, not yours) itself. */
  work(id: number): Observable<AssignmentWorkView> {
    return this.http.get<AssignmentWorkView>(`/api/training/assignments/${id}/work`, { context: quietErrors() });
  }

  /** Reveals the next hint of one problem; a refusal (409: closed meanwhile) is shown on the problem. */
  hint(id: number, position: number): Observable<ProblemDto> {
    return this.http.post<ProblemDto>(`/api/training/assignments/${id}/problems/${position}/hints`, {}, { context: quietErrors() });
  }

  /** Sends an answer; the server grades it. An unreadable answer is a 400 for the card to show. */
  attempt(id: number, position: number, answer: string): Observable<AttemptResultDto> {
    return this.http.post<AttemptResultDto>(`/api/training/assignments/${id}/problems/${position}/attempts`, { answer }, { context: quietErrors() });
  }

  /** One apprentice's work with answers and worked solutions (leads and admins); the page shows any refusal itself. */
  review(id: number | string, userId: number | string): Observable<WorkReviewDto> {
    return this.http.get<WorkReviewDto>(`/api/training/assignments/${id}/work/${userId}`, { context: quietErrors() });
  }

  /** The score table (leads and admins). */
  scores(): Observable<ScoreTableDto> {
    return this.http.get<ScoreTableDto>('/api/training/scores');
  }
}
