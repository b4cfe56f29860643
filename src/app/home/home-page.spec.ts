import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HomePage } from './home-page';

describe('HomePage', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [HomePage],
      providers: [provideZonelessChangeDetection(), provideHttpClient(), provideHttpClientTesting()],
    });
  });

  it('lists the four steps of the job and the safety cautions', async () => {
    const fixture = TestBed.createComponent(HomePage);
    await fixture.whenStable();
    const page = fixture.nativeElement as HTMLElement;
    expect(page.querySelectorAll('.rf-steps li').length).toBe(4);
    expect(page.querySelector('.rf-cautions')?.textContent).toContain('Electricity near water');
  });

  it('shows the service status from the health endpoint', async () => {
    const fixture = TestBed.createComponent(HomePage);
    fixture.detectChanges();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/v1/health')
      .flush({ status: 'ok', database: 'up', version: '9.9.9' });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelector('.rf-status')?.textContent).toContain(
      'database up, version 9.9.9',
    );
  });

  it('says so when the service cannot be reached', async () => {
    const fixture = TestBed.createComponent(HomePage);
    fixture.detectChanges();
    TestBed.inject(HttpTestingController).expectOne('/api/v1/health').error(new ProgressEvent('error'));
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelector('.rf-status')?.textContent).toContain(
      'cannot be reached',
    );
  });
});
