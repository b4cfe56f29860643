import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { PREFERENCE_SAVE_DELAY_MS, UserPreferences } from './user-preferences';
import { SessionService } from './session-service';

const url = '/api/v1/account/preferences';
const session = {
  token: 'rfs_AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA',
  expiresAt: new Date(Date.now() + 3600_000).toISOString(),
  user: { id: 7, email: 'designer@riffle.test', name: 'Demo Designer', role: 'designer' as const, supplierId: null },
};

describe('UserPreferences', () => {
  let controller: HttpTestingController;

  beforeEach(() => {
    vi.useFakeTimers();
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideZonelessChangeDetection(), provideHttpClient(), provideHttpClientTesting()],
    });
    controller = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    controller.verify();
    vi.useRealTimers();
  });

  function signIn(): UserPreferences {
    const preferences = TestBed.inject(UserPreferences);
    TestBed.inject(SessionService).start(session);
    TestBed.tick();
    return preferences;
  }

  it('loads at sign-in: unknown until the server answers, then its choice or null', () => {
    const preferences = TestBed.inject(UserPreferences);
    TestBed.tick();
    controller.expectNone(url); // nobody signed in: nothing asked
    TestBed.inject(SessionService).start(session);
    TestBed.tick();
    expect(preferences.candidateColumns()).toBeUndefined();
    controller.expectOne({ method: 'GET', url }).flush({ candidateColumns: ['flow', 'head'], updatedAt: null });
    expect(preferences.candidateColumns()).toEqual(['flow', 'head']);
  });

  it('asks again at the next sign-in of the same user, after a load the server refused', () => {
    const preferences = signIn();
    controller.expectOne({ method: 'GET', url }).flush(null, { status: 401, statusText: 'Unauthorized' });
    expect(preferences.candidateColumns()).toBeUndefined();
    // a sign-in answer is read afresh: the same user, a new object
    TestBed.inject(SessionService).start({
      ...session,
      token: 'rfs_BBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBB',
      user: { ...session.user },
    });
    TestBed.tick();
    controller.expectOne({ method: 'GET', url }).flush({ candidateColumns: ['head'], updatedAt: null });
    expect(preferences.candidateColumns()).toEqual(['head']);
  });

  it('sends one save for quick changes, the last one, once they rest', () => {
    const preferences = signIn();
    controller.expectOne({ method: 'GET', url }).flush({ candidateColumns: null, updatedAt: null });
    preferences.saveCandidateColumns(['flow']);
    vi.advanceTimersByTime(PREFERENCE_SAVE_DELAY_MS / 2);
    preferences.saveCandidateColumns(['flow', 'bep']);
    expect(preferences.candidateColumns()).toEqual(['flow', 'bep']);
    vi.advanceTimersByTime(PREFERENCE_SAVE_DELAY_MS - 1);
    controller.expectNone({ method: 'PUT', url });
    vi.advanceTimersByTime(1);
    const put = controller.expectOne({ method: 'PUT', url });
    expect(put.request.body).toEqual({ candidateColumns: ['flow', 'bep'] });
    expect(localStorage.getItem('riffle.preferences-unsent.7')).not.toBeNull();
    put.flush({ candidateColumns: ['flow', 'bep'], updatedAt: '2026-12-03T12:30:00.000Z' });
    expect(localStorage.getItem('riffle.preferences-unsent.7')).toBeNull();
  });

  it('keeps a change made while the load was on its way', () => {
    const preferences = signIn();
    preferences.saveCandidateColumns(['reasons']);
    controller.expectOne({ method: 'GET', url }).flush({ candidateColumns: ['flow'], updatedAt: null });
    expect(preferences.candidateColumns()).toEqual(['reasons']);
    vi.advanceTimersByTime(PREFERENCE_SAVE_DELAY_MS);
    controller.expectOne({ method: 'PUT', url }).flush({ candidateColumns: ['reasons'], updatedAt: null });
  });

  it('says nothing when the server fails, and sends the missed save again at the next load, where it wins', () => {
    const preferences = signIn();
    controller.expectOne({ method: 'GET', url }).flush(null, { status: 503, statusText: 'Service Unavailable' });
    expect(preferences.candidateColumns()).toBeUndefined();
    preferences.saveCandidateColumns(['misses']);
    vi.advanceTimersByTime(PREFERENCE_SAVE_DELAY_MS);
    controller.expectOne({ method: 'PUT', url }).flush(null, { status: 503, statusText: 'Service Unavailable' });
    expect(preferences.candidateColumns()).toEqual(['misses']);

    // a later page of the same browser: the server still has the older choice
    TestBed.resetTestingModule();
    TestBed.configureTestingModule({
      providers: [provideZonelessChangeDetection(), provideHttpClient(), provideHttpClientTesting()],
    });
    controller = TestBed.inject(HttpTestingController);
    const later = TestBed.inject(UserPreferences);
    TestBed.tick();
    controller.expectOne({ method: 'GET', url }).flush({ candidateColumns: ['flow', 'head'], updatedAt: null });
    expect(later.candidateColumns()).toEqual(['misses']);
    vi.advanceTimersByTime(PREFERENCE_SAVE_DELAY_MS);
    const resent = controller.expectOne({ method: 'PUT', url });
    expect(resent.request.body).toEqual({ candidateColumns: ['misses'] });
    resent.flush({ candidateColumns: ['misses'], updatedAt: null });
    expect(localStorage.getItem('riffle.preferences-unsent.7')).toBeNull();
  });

  it('drops a save the server refuses as it stands, so it is not sent at every load', () => {
    const preferences = signIn();
    controller.expectOne({ method: 'GET', url }).flush({ candidateColumns: null, updatedAt: null });
    preferences.saveCandidateColumns(['flow']);
    vi.advanceTimersByTime(PREFERENCE_SAVE_DELAY_MS);
    controller.expectOne({ method: 'PUT', url }).flush(null, { status: 422, statusText: 'Unprocessable Content' });
    expect(localStorage.getItem('riffle.preferences-unsent.7')).toBeNull();
  });
});
