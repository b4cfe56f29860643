import { HttpErrorResponse } from '@angular/common/http';
import { describeHttpError } from './problem-details';

describe('describeHttpError', () => {
  it('shows the title, detail and field of problem details', () => {
    const error = new HttpErrorResponse({
      status: 400,
      error: {
        type: '/api/v1/problems/invalid-request',
        title: 'Invalid request',
        status: 400,
        detail: 'must be > 0',
        pointer: '/body/segments/0/length',
      },
    });
    expect(describeHttpError(error)).toBe('Invalid request: must be > 0 (/body/segments/0/length)');
  });

  it('says the server cannot be reached when there was no answer', () => {
    expect(describeHttpError(new HttpErrorResponse({ status: 0 }))).toContain('cannot be reached');
  });

  it('falls back to the status line when the body is not problem details', () => {
    expect(describeHttpError(new HttpErrorResponse({ status: 502, statusText: 'Bad Gateway', error: '<html>' }))).toBe(
      'The server answered 502 Bad Gateway.',
    );
  });
});
