import { HttpClient, type HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { LabSettingsBody, LabSettingsDto } from '@shared/schemas/lab-settings';
import { callerHandles } from '../http/caller-handles';

/** The lab's settings: everyone signed in reads them; admins save them. */
@Injectable({ providedIn: 'root' })
export class LabSettingsApi {
  private readonly http = inject(HttpClient);

  /** `context`: e.g. statuses a background caller handles itself. */
  get(context?: HttpContext): Observable<LabSettingsDto> {
    return this.http.get<LabSettingsDto>('/api/settings/lab', context ? { context } : {});
  }

  /** The screen shows 400 field errors and the 409 of a stale save itself. */
  save(body: LabSettingsBody): Observable<LabSettingsDto> {
    return this.http.put<LabSettingsDto>('/api/settings/lab', body, { context: callerHandles(400, 409) });
  }
}
