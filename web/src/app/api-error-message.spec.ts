import { HttpErrorResponse } from '@angular/common/http';

import { apiErrorMessage } from './api-error-message';

describe('apiErrorMessage', () => {
  it('should use the message of an API error body', () => {
    const error = new HttpErrorResponse({
      status: 409,
      error: { error: { code: 'conflict', message: 'That name is taken.' } },
    });
    expect(apiErrorMessage(error)).toBe('That name is taken.');
  });

  it('should say the server could not be reached for status 0', () => {
    expect(apiErrorMessage(new HttpErrorResponse({ status: 0 }))).toMatch(/could not be reached/);
  });

  it('should name the status when the body is not an API error', () => {
    const error = new HttpErrorResponse({ status: 502, error: '<html>Bad gateway</html>' });
    expect(apiErrorMessage(error)).toMatch(/status 502/);
  });

  it('should fall back to a general sentence for non-HTTP errors', () => {
    expect(apiErrorMessage(new Error('boom'))).toMatch(/Something went wrong/);
  });
});
