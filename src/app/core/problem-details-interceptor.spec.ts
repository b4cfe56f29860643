import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { problemDetailsInterceptor, problemShownByCaller } from './problem-details-interceptor';

const problem = { title: 'Wrong current password', status: 422, detail: 'The current password is not right' };

describe('problemDetailsInterceptor', () => {
  let open: ReturnType<typeof vi.fn>;

  beforeEach(() => {
    open = vi.fn();
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(withInterceptors([problemDetailsInterceptor])),
        provideHttpClientTesting(),
        { provide: MatSnackBar, useValue: { open } },
      ],
    });
  });

  it('says a problem in a snack bar and still hands the error to the caller', async () => {
    let handed = false;
    TestBed.inject(HttpClient)
      .get('/api/v1/pumps')
      .subscribe({ error: () => (handed = true) });
    TestBed.inject(HttpTestingController)
      .expectOne('/api/v1/pumps')
      .flush(problem, { status: 422, statusText: 'Unprocessable Content' });
    expect(handed).toBe(true);
    await vi.waitFor(() =>
      expect(open).toHaveBeenCalledWith(
        'Wrong current password: The current password is not right',
        'Dismiss',
        expect.anything(),
      ),
    );
  });

  it('leaves the problem to a form that shows it itself', async () => {
    let handed = false;
    const client = TestBed.inject(HttpClient);
    const backend = TestBed.inject(HttpTestingController);
    client.put('/api/v1/account/password', {}, problemShownByCaller()).subscribe({ error: () => (handed = true) });
    backend.expectOne('/api/v1/account/password').flush(problem, { status: 422, statusText: 'Unprocessable Content' });
    expect(handed).toBe(true);
    // a later problem without the form's context is said; by then the first would have been too
    client.get('/api/v1/pumps').subscribe({ error: () => undefined });
    backend.expectOne('/api/v1/pumps').flush({ ...problem, title: 'Later' }, { status: 422, statusText: 'x' });
    await vi.waitFor(() => expect(open).toHaveBeenCalled());
    expect(open).toHaveBeenCalledTimes(1);
    expect(open.mock.calls[0][0]).toMatch(/^Later/);
  });
});
