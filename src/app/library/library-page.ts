import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatChipsModule } from '@angular/material/chips';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { catchError, debounceTime, map, of, startWith, switchMap } from 'rxjs';

import { SETUP_KINDS, SETUP_STATUSES, type SetupOwnerDto, type SetupPageDto, type SetupSort, type SetupStatus } from '../../../shared/api/setup';
import { apiErrorDetail } from '../core/api-error';
import { Auth } from '../core/auth';
import { KIND_AREAS, LibraryApi, STATUS_LABELS, type LibraryQuery } from './library-api';
import { type LibraryReturnState, type LibraryView, PAGE_SIZES, paramsOfView, sameView, viewFromParams } from './library-url';

/** The set-up library: the team's set-ups with search, filters, sort and server-side paging. */
@Component({
  selector: 'app-library-page',
  imports: [
    DatePipe, FormsModule, RouterLink, MatButtonModule, MatChipsModule, MatFormFieldModule, MatIconModule, MatInputModule,
    MatPaginatorModule, MatProgressBarModule, MatSelectModule, MatSortModule, MatTableModule,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './library-page.html',
  styleUrl: './library-page.scss',
})
export default class LibraryPage {
  private readonly api = inject(LibraryApi);
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly route = inject(ActivatedRoute);
  /** The view the address asks for (filters, sort, page), so going back to the list finds it as it was. */
  private readonly initial = viewFromParams((name) => this.route.snapshot.queryParamMap.get(name));

  protected readonly kinds = SETUP_KINDS;
  protected readonly statuses = SETUP_STATUSES;
  protected readonly pageSizes = [...PAGE_SIZES];
  protected readonly columns = ['name', 'kind', 'status', 'job', 'owner', 'updatedAt'];

  protected readonly search = signal(this.initial.search);
  protected readonly kind = signal(this.initial.kind);
  protected readonly status = signal<SetupStatus | ''>(this.initial.status);
  protected readonly job = signal(this.initial.job);
  /** The owner filter: '' anyone, 'me' the signed-in member, otherwise an owner's id. */
  protected readonly owner = signal(this.initial.owner);
  /** Owners of set-ups this member may see (not the member), for the owner filter. */
  protected readonly owners = toSignal(
    this.api.owners().pipe(
      map((list) => list.filter((o) => o.id !== this.auth.user()?.id)),
      catchError(() => of([] as SetupOwnerDto[])),
    ),
    { initialValue: [] as SetupOwnerDto[] },
  );
  protected readonly sort = signal<Sort>(this.initial.sort);
  protected readonly pageIndex = signal(this.initial.pageIndex);
  protected readonly pageSize = signal(this.initial.pageSize);
  protected readonly importing = signal(false);
  /** Why the last import failed, shown above the list until the next import or until dismissed. */
  protected readonly importError = signal<string | null>(null);

  /** The query the filters make; any change goes back to page 1 except paging itself. */
  protected readonly query = computed<LibraryQuery>(() => ({
    q: this.search().trim(),
    kind: this.kind(),
    status: this.status(),
    job: this.job().trim(),
    ownerId: this.owner() === 'me' ? (this.auth.user()?.id ?? null) : this.owner() ? Number(this.owner()) : null,
    sort: (this.sort().direction ? this.sort().active : 'updatedAt') as SetupSort,
    dir: this.sort().direction || 'desc',
    page: this.pageIndex() + 1,
    pageSize: this.pageSize(),
  }));

  private readonly result = toSignal(
    toObservable(this.query).pipe(
      debounceTime(250),
      switchMap((q) =>
        this.api.list(q).pipe(
          map((page) => ({ loading: false, page, error: null as string | null })),
          catchError((err: unknown) => of({ loading: false, page: null, error: apiErrorDetail(err) })),
          startWith({ loading: true, page: null as SetupPageDto | null, error: null as string | null }),
        ),
      ),
    ),
    { initialValue: { loading: true, page: null, error: null } },
  );
  private readonly lastPage = signal<SetupPageDto | null>(null);

  /** Rows shown: the latest page, kept while the next one loads. */
  protected readonly page = computed(() => this.result().page ?? this.lastPage());
  protected readonly loading = computed(() => this.result().loading);
  protected readonly error = computed(() => this.result().error);
  protected readonly rows = computed(() => this.page()?.setups ?? []);
  protected readonly total = computed(() => this.page()?.total ?? 0);

  /** The address parameters this page last wrote (JSON), told apart from addresses changed from outside. */
  private written: string | null = null;

  /** The view the controls hold now. */
  private readonly view = computed<LibraryView>(() => ({
    search: this.search(),
    kind: this.kind(),
    status: this.status(),
    job: this.job(),
    owner: this.owner(),
    sort: this.sort(),
    pageIndex: this.pageIndex(),
    pageSize: this.pageSize(),
  }));

  /** What a row hands the set-up it opens, so its "Set-up library" link comes back to this list as it is. */
  protected readonly returnState = computed<LibraryReturnState>(() => ({ libraryList: paramsOfView(this.view()) }));

  constructor() {
    toObservable(this.result).subscribe((r) => {
      if (r.page) this.lastPage.set(r.page);
      // A page past the end (an old bookmark, or set-ups deleted meanwhile): show the last page there is.
      if (r.page && r.page.setups.length === 0 && r.page.total > 0 && this.pageIndex() > 0) {
        this.pageIndex.set(Math.max(0, Math.ceil(r.page.total / this.pageSize()) - 1));
      }
    });
    // The address follows the view (replacing the entry: typing a search makes no history), and the
    // view follows an address changed from outside (the menu's plain /library, back and forward).
    toObservable(this.view)
      .pipe(debounceTime(250), takeUntilDestroyed())
      .subscribe((view) => {
        const now = viewFromParams((name) => this.route.snapshot.queryParamMap.get(name));
        if (sameView(view, now)) return;
        const queryParams = paramsOfView(view);
        this.written = JSON.stringify(queryParams);
        void this.router.navigate([], { relativeTo: this.route, queryParams, replaceUrl: true });
      });
    this.route.queryParamMap.pipe(takeUntilDestroyed()).subscribe((params) => {
      const wanted = viewFromParams((name) => params.get(name));
      // The address this page wrote itself is already shown (or was typed past meanwhile).
      if (JSON.stringify(paramsOfView(wanted)) === this.written) return;
      if (!sameView(wanted, this.view())) this.show(wanted);
    });
  }

  private show(view: LibraryView): void {
    this.search.set(view.search);
    this.kind.set(view.kind);
    this.status.set(view.status);
    this.job.set(view.job);
    this.owner.set(view.owner);
    this.sort.set(view.sort);
    this.pageIndex.set(view.pageIndex);
    this.pageSize.set(view.pageSize);
  }

  protected kindLabel(kind: string): string {
    return KIND_AREAS[kind]?.label ?? kind;
  }

  protected statusLabel(status: string): string {
    return STATUS_LABELS[status as SetupStatus] ?? status;
  }

  /** Sets a filter and goes back to the first page. */
  protected setFilter(apply: () => void): void {
    apply();
    this.pageIndex.set(0);
  }

  protected changeSort(sort: Sort): void {
    this.sort.set(sort);
    this.pageIndex.set(0);
  }

  protected changePage(event: PageEvent): void {
    this.pageSize.set(event.pageSize);
    this.pageIndex.set(event.pageIndex);
  }

  protected clearFilters(): void {
    this.search.set('');
    this.kind.set('');
    this.status.set('');
    this.job.set('');
    this.owner.set('');
    this.pageIndex.set(0);
  }

  /** Reads an exported set-up file and imports it as a draft of this team, saying how it went. */
  protected async importFile(input: HTMLInputElement): Promise<void> {
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    this.importing.set(true);
    this.importError.set(null);
    const failed = (why: string) => {
      this.importing.set(false);
      this.importError.set(`Import of "${file.name}" failed: ${why}`);
    };
    let json: unknown;
    try {
      json = JSON.parse(await file.text());
    } catch {
      failed('the file is not a set-up exported from Slantwise (not valid JSON).');
      return;
    }
    this.api.import(json).subscribe({
      next: (setup) => {
        this.importing.set(false);
        // Replaces any message still open (an earlier failure, say).
        this.snackBar.open(`Imported "${setup.name}" as a draft.`, 'OK', { duration: 6_000, politeness: 'polite' });
        void this.router.navigate(['/library', setup.id], { state: this.returnState() });
      },
      error: (err: unknown) => failed(apiErrorDetail(err)),
    });
  }
}
