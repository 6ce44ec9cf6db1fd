import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import { api } from '../api/client.js';
import type { KeySummary } from '../api/types.js';
import { TaskController, TaskStatus } from '../controllers/task-controller.js';
import { sharedStyles } from '../lib/shared-styles.js';
import './sheaf-error-note.js';

/**
 * API keys of one router: create (the secret is shown once and handed to the page in memory via
 * `key-created` `{key}`; it is never stored in the browser), list and revoke.
 */
export class SheafKeyManager extends LitElement {
  static override properties = { routerId: { type: String }, fresh: { state: true }, error: { state: true }, busy: { state: true } };
  routerId = '';
  fresh = '';
  error: unknown = null;
  busy = false;
  private keys = new TaskController<KeySummary[] | null>(this);

  static override styles = [
    sharedStyles,
    css`
      code.key { font-family: var(--mono); font-size: 0.85rem; background: var(--paper); border: 1px solid var(--line); padding: 0.3rem 0.5rem; border-radius: 4px; overflow-wrap: anywhere; display: block; user-select: all; }
    `,
  ];

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('routerId') && this.routerId) {
      this.fresh = '';
      void this.refresh();
    }
  }

  private refresh() {
    const rid = this.routerId;
    return this.keys.run(async (signal) => {
      const res = await api.listKeys(rid, signal);
      return Array.isArray(res) ? res : (res.items ?? []);
    });
  }

  private async create() {
    this.busy = true;
    this.error = null;
    try {
      const { key } = await api.createKey(this.routerId);
      this.fresh = key;
      this.dispatchEvent(new CustomEvent('key-created', { detail: { key }, bubbles: true, composed: true }));
      await this.refresh();
    } catch (err) {
      this.error = err;
    } finally {
      this.busy = false;
    }
  }

  private async revoke(k: KeySummary) {
    if (!confirm('Revoke this key? Programs using it will be refused from now on.')) return;
    this.busy = true;
    this.error = null;
    try {
      await api.revokeKey(this.routerId, k.id);
      this.dispatchEvent(new CustomEvent('key-revoked', { detail: { id: k.id }, bubbles: true, composed: true }));
      await this.refresh();
    } catch (err) {
      this.error = err;
    } finally {
      this.busy = false;
    }
  }

  override render() {
    const list = this.keys.value;
    return html`<div class="stack">
      <div class="row">
        <button class="primary" ?disabled=${this.busy} @click=${this.create}>Create a key</button>
        <span class="small muted">Programs send it as <code>Authorization: Bearer …</code>.</span>
      </div>
      ${this.fresh
        ? html`<div class="note info stack" role="status">
            <div>Copy this key now. It is shown only once; sheaf keeps only a hash of it.</div>
            <code class="key" data-role="new-key">${this.fresh}</code>
          </div>`
        : nothing}
      <sheaf-error-note .error=${this.error} context="Key change failed"></sheaf-error-note>
      ${this.keys.status === TaskStatus.Error ? html`<p class="small muted">Keys cannot be listed on this server.</p>` : nothing}
      ${list && list.length
        ? html`<table aria-label="Keys">
            <thead><tr><th scope="col">Key</th><th scope="col">Created</th><th scope="col">Last used</th><th></th></tr></thead>
            <tbody>
              ${list.map(
                (k) => html`<tr>
                  <td><code>${k.prefix ? `${k.prefix}…` : k.label ?? k.id}</code></td>
                  <td>${k.createdAt ? new Date(k.createdAt).toLocaleString() : '—'}</td>
                  <td>${k.lastUsedAt ? new Date(k.lastUsedAt).toLocaleString() : 'never'}</td>
                  <td>${k.revokedAt
                    ? html`<span class="small muted">revoked ${new Date(k.revokedAt).toLocaleDateString()}</span>`
                    : html`<button class="quiet danger" ?disabled=${this.busy} @click=${() => this.revoke(k)}>Revoke</button>`}</td>
                </tr>`,
              )}
            </tbody>
          </table>`
        : list
          ? html`<p class="small muted">No keys yet.</p>`
          : nothing}
    </div>`;
  }
}
customElements.define('sheaf-key-manager', SheafKeyManager);
