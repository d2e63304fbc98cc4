import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { UserList } from './user-list';

const row = (id: number, signIn: { failures: number; locked: boolean }) => ({
  id,
  email: `u${id}@example.test`,
  displayName: `User ${id}`,
  roles: ['fan'],
  emailVerified: true,
  createdAt: '2026-12-01T00:00:00Z',
  deletedAt: null,
  signIn,
});

// The first render compiles Material's table, select, toggles and dialog; on a busy two-core machine that alone can pass jest's 5 s.
jest.setTimeout(30_000);

describe('UserList', () => {
  beforeEach(() => TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] }));

  it('should show a locked account in words and clear its lock with the button', async () => {
    const fixture = TestBed.createComponent(UserList);
    const http = TestBed.inject(HttpTestingController);
    // The list is requested from an effect; stability waits for the answer, so flush it first.
    fixture.detectChanges();
    TestBed.tick();
    http
      .expectOne((r) => r.url === '/api/admin/users')
      .flush({
        items: [row(7, { failures: 100, locked: true }), row(8, { failures: 0, locked: false })],
        total: 2,
        page: 1,
        pageSize: 25,
      });
    await fixture.whenStable();
    const text = fixture.nativeElement.textContent as string;
    expect(text).toContain('Locked after 100 failed attempts');
    expect(text).toContain('No failed attempts');
    const buttons = fixture.nativeElement.querySelectorAll(
      'button[aria-label^="Clear the sign-in lock"]',
    ) as NodeListOf<HTMLButtonElement>;
    expect(buttons).toHaveLength(1);
    expect(buttons[0].getAttribute('aria-label')).toBe('Clear the sign-in lock of User 7');
    buttons[0].click();
    const clear = http.expectOne('/api/admin/users/7/sign-in-lock');
    expect(clear.request.method).toBe('DELETE');
    clear.flush(null, { status: 204, statusText: 'No Content' });
    await Promise.resolve();
    TestBed.tick();
    http
      .expectOne((r) => r.url === '/api/admin/users')
      .flush({ items: [row(7, { failures: 0, locked: false })], total: 1, page: 1, pageSize: 25 });
    await fixture.whenStable();
    expect(fixture.nativeElement.textContent).not.toContain('Locked after');
  });

  it('should show an account its owner deleted as deleted, with no role switches or lock button', async () => {
    const fixture = TestBed.createComponent(UserList);
    const http = TestBed.inject(HttpTestingController);
    fixture.detectChanges();
    TestBed.tick();
    const gone = {
      ...row(9, { failures: 2, locked: false }),
      displayName: 'Deleted account #9',
      email: 'deleted-9@deleted.invalid',
      roles: [],
      deletedAt: '2026-12-02T15:00:00Z',
    };
    http.expectOne((r) => r.url === '/api/admin/users').flush({ items: [gone], total: 1, page: 1, pageSize: 25 });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.textContent).toContain('Deleted account #9');
    expect(el.textContent).toContain('Deleted by its owner on Dec 2, 2026');
    expect(el.querySelector('mat-button-toggle-group')).toBeNull();
    expect(el.querySelector('button[aria-label^="Clear the sign-in lock"]')).toBeNull();
  });
});
