import { HttpClient, HttpContext, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { BACKGROUND_REQUEST, authTokenInterceptor } from './auth-token-interceptor';
import { SessionService } from './session-service';

const session = {
  token: 'rfs_AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA',
  expiresAt: new Date(Date.now() + 3600_000).toISOString(),
  user: { id: 2, email: 'designer@riffle.test', name: 'Demo Designer', role: 'designer' as const, supplierId: null },
};

describe('authTokenInterceptor and SessionService', () => {
  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([authTokenInterceptor])),
        provideHttpClientTesting(),
      ],
    });
  });

  it('sends the bearer token to the API only, while signed in', () => {
    const http = TestBed.inject(HttpClient);
    const controller = TestBed.inject(HttpTestingController);
    http.get('/api/v1/health').subscribe();
    expect(controller.expectOne('/api/v1/health').request.headers.has('Authorization')).toBe(false);
    TestBed.inject(SessionService).start(session);
    http.get('/api/v1/auth/me').subscribe();
    expect(controller.expectOne('/api/v1/auth/me').request.headers.get('Authorization')).toBe(
      `Bearer ${session.token}`,
    );
    http.get('/riffle-mark.svg').subscribe();
    expect(controller.expectOne('/riffle-mark.svg').request.headers.has('Authorization')).toBe(false);
  });

  it('ends the session and opens sign-in when the API refuses the token', () => {
    const sessions = TestBed.inject(SessionService);
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    sessions.start(session);
    TestBed.inject(HttpClient)
      .get('/api/v1/account/api-tokens')
      .subscribe({ error: () => undefined });
    TestBed.inject(HttpTestingController)
      .expectOne('/api/v1/account/api-tokens')
      .flush({ title: 'Sign-in required', status: 401 }, { status: 401, statusText: 'Unauthorized' });
    expect(sessions.signedIn()).toBe(false);
    expect(localStorage.getItem('riffle.session')).toBeNull();
    expect(navigate).toHaveBeenCalledWith(['/accounts/sign-in'], { queryParams: { returnTo: '/' } });
  });

  it('leaves the session and the page alone when a request the app made by itself is refused', () => {
    const sessions = TestBed.inject(SessionService);
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    sessions.start(session);
    TestBed.inject(HttpClient)
      .get('/api/v1/account/preferences', { context: new HttpContext().set(BACKGROUND_REQUEST, true) })
      .subscribe({ error: () => undefined });
    const refused = TestBed.inject(HttpTestingController).expectOne('/api/v1/account/preferences');
    expect(refused.request.headers.get('Authorization')).toBe(`Bearer ${session.token}`);
    refused.flush({ title: 'Sign-in required', status: 401 }, { status: 401, statusText: 'Unauthorized' });
    expect(sessions.signedIn()).toBe(true);
    expect(navigate).not.toHaveBeenCalled();
  });

  it('forgets an expired session and filters pages by role', () => {
    const sessions = TestBed.inject(SessionService);
    sessions.start({ ...session, expiresAt: new Date(Date.now() - 1000).toISOString() });
    expect(sessions.token()).toBeNull();
    expect(sessions.hasRole(['designer'])).toBe(false);
    sessions.start(session);
    expect(sessions.hasRole(['designer', 'admin'])).toBe(true);
    expect(sessions.hasRole(['admin'])).toBe(false);
    expect(sessions.hasRole(undefined)).toBe(true);
  });
});
