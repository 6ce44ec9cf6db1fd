import { LitElement, html, nothing } from 'lit';
import { ApiError, detailPhrases, plainWords } from '../api/api-error.js';
import { sharedStyles } from '../lib/shared-styles.js';

/**
 * Shows an error in plain words, with the server's details underneath, in a live region so
 * screen readers announce it. Renders nothing when there is no error.
 */
export class SheafErrorNote extends LitElement {
  static override properties = { error: { attribute: false }, context: { type: String } };
  /** The error to show (anything thrown). */
  error: unknown = null;
  /** What was being attempted, e.g. "Upload failed". */
  context = '';
  static override styles = sharedStyles;

  override render() {
    if (this.error === null || this.error === undefined) return html`<div role="alert" aria-live="assertive"></div>`;
    const details = this.error instanceof ApiError ? detailPhrases(this.error.details) : [];
    return html`<div class="note bad" role="alert" aria-live="assertive">
      <strong>${this.context ? `${this.context}: ` : ''}</strong>${plainWords(this.error)}
      ${details.length ? html`<ul class="small">${details.map((d) => html`<li>${d}</li>`)}</ul>` : nothing}
    </div>`;
  }
}
customElements.define('sheaf-error-note', SheafErrorNote);
