import { Injectable, signal } from '@angular/core';

/**
 * Whether a photo the author chose is not on the server yet (still uploading, or its upload
 * failed), so the editor can refuse to submit the version and ask before the page is left:
 * a chosen photo is never lost without a word. Provided by the editor, one per editor.
 */
@Injectable()
export class PhotoUploads {
  /** What is pending, in a sentence ("setup.png is still uploading."), or '' when nothing is. */
  readonly pending = signal('');
}
