import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import { Auth } from '../core/auth';
import TeamPage from './team-page';

const ADMIN = { id: 1, email: 'admin@demo.test', name: 'Mara Lindqvist', role: 'admin' as const };
const LEAD = { id: 2, email: 'lead@demo.test', name: 'Teodor Vance', role: 'lead' as const };
const member = (id: number, name: string, role: string, active = true) => ({ id, name, role, active, email: `${id}@demo.test`, createdAt: '2026-12-01T00:00:00Z' });

describe('TeamPage', () => {
  let fixture: ComponentFixture<TeamPage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  async function open(user: typeof ADMIN | typeof LEAD): Promise<void> {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    jest.spyOn(TestBed.inject(Auth), 'ready').mockResolvedValue(user);
    jest.spyOn(TestBed.inject(Auth), 'user').mockReturnValue(user);
    fixture = TestBed.createComponent(TeamPage);
    el = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  }

  afterEach(() => http.verify());

  /** Lets the page's awaited requests settle and re-render. */
  async function settle(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
  }

  /** Opens the page as the admin and answers its three loads: the members given, no invitations, an empty mailbox. */
  async function openAsAdmin(members: ReturnType<typeof member>[]): Promise<void> {
    await open(ADMIN);
    http.expectOne('/api/team/members').flush({ members });
    await settle();
    http.expectOne('/api/team/invitations').flush({ invitations: [] });
    await settle();
    http.expectOne('/api/team/mailbox').flush({ messages: [] });
    await settle();
  }

  it('should list members with deactivate buttons for an admin, and load invitations and the mailbox', async () => {
    await openAsAdmin([member(1, 'Mara Lindqvist', 'admin'), member(4, 'Sam Okafor', 'apprentice')]);
    expect(el.textContent).toContain('Sam Okafor');
    const buttons = Array.from(el.querySelectorAll('button')).map((b) => b.textContent?.trim());
    expect(buttons.some((t) => t?.includes('Deactivate'))).toBe(true);
    expect(el.textContent).toContain('Dev mailbox');
  });

  it('should change a role only after asking, put the picker back when not, and say what was done', async () => {
    await openAsAdmin([member(1, 'Mara Lindqvist', 'admin'), member(4, 'Sam Okafor', 'apprentice')]);
    const page = fixture.componentInstance as unknown as { setRole(m: unknown, role: string, picker: { value: unknown }): Promise<void> };
    const sam = member(4, 'Sam Okafor', 'apprentice');
    const picker = { value: 'lead' as unknown };
    const ask = jest.spyOn(window, 'confirm').mockReturnValueOnce(false);
    await page.setRole(sam, 'lead', picker);
    expect(ask).toHaveBeenCalledWith(expect.stringMatching(/^Change Sam Okafor's role from Apprentice to Lead hand\?/));
    http.expectNone('/api/team/members/4');
    expect(picker.value).toBe('apprentice');
    ask.mockReturnValueOnce(true);
    const done = page.setRole(sam, 'lead', picker);
    const req = http.expectOne('/api/team/members/4');
    expect(req.request.body).toEqual({ role: 'lead' });
    req.flush({ ...sam, role: 'lead' });
    await done;
    await settle();
    expect(el.querySelector('p[role="status"]')?.textContent).toContain('Sam Okafor is now Lead hand.');
    ask.mockRestore();
  });

  it('should offer admins, and only admins, the download of all team data', async () => {
    await openAsAdmin([member(1, 'Mara Lindqvist', 'admin')]);
    const link = el.querySelector<HTMLAnchorElement>('a[href="/api/team/export"]');
    expect(link?.textContent).toContain('Download all team data');
    expect(link?.hasAttribute('download')).toBe(true);
    // The archive carries password hashes: the admin is told to keep it private.
    expect(el.querySelector('.team-export')?.textContent).toContain('password hash');

    TestBed.resetTestingModule();
    await open(LEAD);
    http.expectOne('/api/team/members').flush({ members: [member(2, 'Teodor Vance', 'lead')] });
    await settle();
    expect(el.querySelector('a[href="/api/team/export"]')).toBeNull();
  });

  it('should deactivate a member with PATCH active=false after asking', async () => {
    await open(ADMIN);
    http.expectOne('/api/team/members').flush({ members: [member(1, 'Mara Lindqvist', 'admin'), member(4, 'Sam Okafor', 'apprentice')] });
    await settle();
    http.expectOne('/api/team/invitations').flush({ invitations: [] });
    await settle();
    http.expectOne('/api/team/mailbox').flush({ messages: [] }, { status: 404, statusText: 'Not Found' });
    await settle();
    expect(el.textContent).not.toContain('Dev mailbox');
    jest.spyOn(window, 'confirm').mockReturnValue(true);
    const deactivate = Array.from(el.querySelectorAll('button')).find((b) => b.textContent?.includes('Deactivate')) as HTMLButtonElement;
    deactivate.click();
    await settle();
    const req = http.expectOne('/api/team/members/4');
    expect(req.request.method).toBe('PATCH');
    expect(req.request.body).toEqual({ active: false });
    req.flush(member(4, 'Sam Okafor', 'apprentice', false));
    await settle();
    expect(el.textContent).toContain('Deactivated');
  });

  it('should withdraw an invitation only after asking, and say it is withdrawn', async () => {
    await open(ADMIN);
    http.expectOne('/api/team/members').flush({ members: [member(1, 'Mara Lindqvist', 'admin')] });
    await settle();
    const invitation = { id: 7, email: 'new@demo.test', role: 'apprentice', invitedBy: 'Mara Lindqvist', expiresAt: '2026-12-24T00:00:00Z', createdAt: '2026-12-17T00:00:00Z' };
    http.expectOne('/api/team/invitations').flush({ invitations: [invitation] });
    await settle();
    http.expectOne('/api/team/mailbox').flush({ messages: [] });
    await settle();
    const page = fixture.componentInstance as unknown as { revoke(i: unknown): Promise<void> };
    const ask = jest.spyOn(window, 'confirm').mockReturnValueOnce(false);
    await page.revoke(invitation);
    expect(ask).toHaveBeenCalledWith(expect.stringMatching(/^Withdraw the invitation to new@demo\.test\? Its link stops working at once/));
    http.expectNone('/api/team/invitations/7');
    ask.mockReturnValueOnce(true);
    const done = page.revoke(invitation);
    const req = http.expectOne('/api/team/invitations/7');
    expect(req.request.method).toBe('DELETE');
    req.flush(null, { status: 204, statusText: 'No Content' });
    await settle();
    http.expectOne('/api/team/members').flush({ members: [member(1, 'Mara Lindqvist', 'admin')] });
    await settle();
    http.expectOne('/api/team/invitations').flush({ invitations: [] });
    await settle();
    http.expectOne('/api/team/mailbox').flush({ messages: [] });
    await done;
    (Array.from(el.querySelectorAll('[role=tab]')).find((t) => t.textContent?.includes('Invitations')) as HTMLElement).click();
    await settle();
    expect(el.textContent).toContain('The invitation to new@demo.test is withdrawn.');
    ask.mockRestore();
  });

  it('should put the team-data download on its own line, after the words about it', async () => {
    await openAsAdmin([member(1, 'Mara Lindqvist', 'admin')]);
    const link = el.querySelector<HTMLAnchorElement>('a[href="/api/team/export"]')!;
    // The link is alone in its paragraph: no words of the explanation around it.
    expect(link.parentElement?.tagName).toBe('P');
    expect(link.parentElement?.textContent?.trim()).toBe(link.textContent?.trim());
  });

  it('should show each caught message with its recipient and time on their own line', async () => {
    await open(ADMIN);
    http.expectOne('/api/team/members').flush({ members: [member(1, 'Mara Lindqvist', 'admin')] });
    await settle();
    http.expectOne('/api/team/invitations').flush({ invitations: [] });
    await settle();
    const mail = { id: 3, sender: 'noreply@demo.test', recipients: 'machinist@demo.test', subject: 'Set-up released: a rather long name that goes on', text: 'x', html: null, receivedAt: '2026-12-17T08:30:00Z', links: [] };
    http.expectOne('/api/team/mailbox').flush({ messages: [mail] });
    await settle();
    // The message list is on the third tab.
    (Array.from(el.querySelectorAll('[role=tab]')).find((t) => t.textContent?.includes('Dev mailbox')) as HTMLElement).click();
    await settle();
    const head = el.querySelector('.mail-head')!;
    // A plain button (a Material text button keeps its label on one line and cuts it off).
    expect(head.classList.contains('mat-mdc-button')).toBe(false);
    expect(head.querySelector('.mail-meta')?.textContent).toBe('to machinist@demo.test · 2026-12-17 08:30:00');
  });

  it('should show a lead the members read-only, without invitations or mailbox', async () => {
    await open(LEAD);
    http.expectOne('/api/team/members').flush({ members: [member(4, 'Sam Okafor', 'apprentice')] });
    await settle();
    http.expectNone('/api/team/invitations');
    expect(el.textContent).toContain('Sam Okafor');
    expect(Array.from(el.querySelectorAll('button')).some((b) => b.textContent?.includes('Deactivate'))).toBe(false);
  });
});
