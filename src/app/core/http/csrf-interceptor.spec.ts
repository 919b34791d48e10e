import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Session } from '../session/session';
import { csrfInterceptor } from './csrf-interceptor';

describe('csrfInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;
  let token: string | null;

  beforeEach(() => {
    token = 'tok-123';
    TestBed.configureTestingModule({
      providers: [
        { provide: Session, useValue: { csrfToken: () => token } },
        provideHttpClient(withInterceptors([csrfInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  for (const method of ['POST', 'PUT', 'PATCH', 'DELETE']) {
    it(`adds x-csrf-token on ${method}`, () => {
      http.request(method, '/api/things', { body: {} }).subscribe();
      const req = backend.expectOne('/api/things');
      expect(req.request.headers.get('x-csrf-token')).toBe('tok-123');
      req.flush({});
    });
  }

  for (const method of ['GET', 'HEAD', 'OPTIONS']) {
    it(`leaves ${method} without the header`, () => {
      http.request(method, '/api/things').subscribe();
      const req = backend.expectOne('/api/things');
      expect(req.request.headers.has('x-csrf-token')).toBe(false);
      req.flush({});
    });
  }

  it('sends no header when the session has no token yet', () => {
    token = null;
    http.post('/api/things', {}).subscribe();
    const req = backend.expectOne('/api/things');
    expect(req.request.headers.has('x-csrf-token')).toBe(false);
    req.flush({});
  });
});
