import { LitElement, css, html, nothing } from 'lit';
import { uploadCorpus } from '../api/upload.js';
import type { CorpusCreated } from '../api/types.js';
import { detectFormat, previewText, type Preview } from '../lib/preview-parse.js';
import { sharedStyles } from '../lib/shared-styles.js';
import './sheaf-error-note.js';

/** Bytes read for the in-browser preview (the whole file is only read by the server). */
const SAMPLE_BYTES = 256 * 1024;
/** Rows shown in the preview table. */
const SHOWN_ROWS = 8;
/** Skipped lines listed after an upload (the count is always shown). */
const SHOWN_SKIPPED = 50;

const FORMAT_WORDS: Record<Preview['format'], string> = {
  csv: 'CSV with a header row',
  ndjson: 'NDJSON (one JSON object per line)',
  json: 'a JSON array',
  lines: 'plain text, one document per line',
};

function clip(s: string, n: number): string {
  return s.length > n ? `${s.slice(0, n - 1)}…` : s;
}

/**
 * Drop or pick a file, see its first rows as the server will read them, choose the text and id
 * fields, and send it. Fires `corpus-created` (detail: the server's answer) on success; the
 * skipped lines stay listed until the next file.
 */
export class SheafUpload extends LitElement {
  static override properties = {
    file: { state: true },
    preview: { state: true },
    name: { state: true },
    textField: { state: true },
    idField: { state: true },
    dragging: { state: true },
    sending: { state: true },
    sent: { state: true },
    error: { state: true },
    result: { state: true },
  };
  file: File | null = null;
  preview: Preview | null = null;
  name = '';
  textField = '';
  idField = '';
  dragging = false;
  sending = false;
  sent = 0;
  error: unknown = null;
  result: CorpusCreated | null = null;
  private abort: AbortController | null = null;

  static override styles = [
    sharedStyles,
    css`
      .drop {
        border: 2px dashed var(--line-strong); border-radius: 10px; padding: 1.4rem; text-align: center;
        background: var(--paper); transition: background 0.15s, border-color 0.15s;
      }
      .drop.over { border-color: var(--accent); background: var(--accent-soft); }
      .drop p { margin: 0.2rem 0 0.6rem; }
      .preview { overflow: auto; max-height: 320px; border: 1px solid var(--line); border-radius: var(--radius); }
      .preview td { max-width: 28rem; }
      .preview th.text-col, .preview td.text-col { background: #f1f6f5; }
      .fields { display: grid; grid-template-columns: repeat(auto-fit, minmax(12rem, 1fr)); gap: 0.6rem; }
      .fields label { display: flex; flex-direction: column; gap: 0.2rem; }
      progress { width: 100%; height: 0.6rem; accent-color: var(--accent); }
      .skipped { max-height: 180px; overflow: auto; }
    `,
  ];

  private onDrop(e: DragEvent) {
    e.preventDefault();
    this.dragging = false;
    const f = e.dataTransfer?.files?.[0];
    if (f) void this.choose(f);
  }

  private onPick(e: Event) {
    const input = e.target as HTMLInputElement;
    const f = input.files?.[0];
    if (f) void this.choose(f);
    input.value = '';
  }

  /**
   * Reads the start of a file and shows the preview.
   * @param f the chosen file
   */
  async choose(f: File): Promise<void> {
    this.file = f;
    this.result = null;
    this.error = null;
    this.name = f.name.replace(/\.[^.]+$/, '') || f.name;
    try {
      const sample = await f.slice(0, SAMPLE_BYTES).text();
      const format = detectFormat(f.name, sample);
      this.preview = previewText(sample, format, { maxRows: 20, truncated: f.size > SAMPLE_BYTES });
      this.textField = this.preview.textField ?? '';
      this.idField = this.preview.idField ?? '';
    } catch (err) {
      this.preview = null;
      this.error = err;
    }
  }

  private reset() {
    this.abort?.abort();
    this.file = null;
    this.preview = null;
    this.error = null;
  }

  private async send(e: Event) {
    e.preventDefault();
    if (!this.file || !this.preview) return;
    const form = new FormData();
    form.set('file', this.file, this.file.name);
    form.set('name', this.name.trim() || this.file.name);
    if (this.preview.format !== 'lines' && this.textField) form.set('textField', this.textField);
    if (this.preview.format !== 'lines' && this.idField) form.set('idField', this.idField);
    this.sending = true;
    this.sent = 0;
    this.error = null;
    const ctl = new AbortController();
    this.abort = ctl;
    try {
      const created = await uploadCorpus(form, (f) => (this.sent = f), ctl.signal);
      this.result = created;
      this.file = null;
      this.preview = null;
      this.dispatchEvent(new CustomEvent('corpus-created', { detail: created, bubbles: true, composed: true }));
    } catch (err) {
      this.error = err;
    } finally {
      this.sending = false;
      this.abort = null;
    }
  }

  private renderPreview(p: Preview) {
    const shown = p.rows.slice(0, SHOWN_ROWS);
    const structured = p.format !== 'lines';
    return html`
      <form class="stack" @submit=${this.send}>
        <p class="small">
          <strong>${this.file?.name}</strong> (${((this.file?.size ?? 0) / 1024).toFixed(0)} KB), read as ${FORMAT_WORDS[p.format]}.
          ${p.partial ? html`Showing the first ${shown.length} rows.` : html`${p.rows.length} row${p.rows.length === 1 ? '' : 's'}.`}
        </p>
        ${p.problems.length
          ? html`<div class="note warn small">
              ${p.problems.slice(0, 5).map((q) => html`<div>Line ${q.line} ${q.reason}.</div>`)}
              ${p.problems.length > 5 ? html`<div>…and ${p.problems.length - 5} more in the preview.</div>` : nothing}
            </div>`
          : nothing}
        ${p.fields.length === 0
          ? html`<div class="note bad">No rows could be read from the start of this file. Check that it is CSV with a header row, NDJSON, a JSON array or plain text.</div>`
          : html`<div class="preview" tabindex="0" aria-label="Preview of the first rows">
              <table>
                <thead><tr>${p.fields.map((f) => html`<th class=${f === this.textField ? 'text-col' : ''} scope="col">${f}</th>`)}</tr></thead>
                <tbody>
                  ${shown.map((r) => html`<tr>${p.fields.map((f) => html`<td class=${f === this.textField ? 'text-col' : ''}>${clip(r[f] ?? '', 160)}</td>`)}</tr>`)}
                </tbody>
              </table>
            </div>`}
        <div class="fields">
          <label>Name<input required .value=${this.name} @input=${(e: Event) => (this.name = (e.target as HTMLInputElement).value)} /></label>
          ${structured
            ? html`<label
                  >Text field
                  <select name="textField" .value=${this.textField} @change=${(e: Event) => (this.textField = (e.target as HTMLSelectElement).value)}>
                    ${p.fields.map((f) => html`<option value=${f} ?selected=${f === this.textField}>${f}</option>`)}
                  </select></label
                >
                <label
                  >Id field (optional)
                  <select name="idField" .value=${this.idField} @change=${(e: Event) => (this.idField = (e.target as HTMLSelectElement).value)}>
                    <option value="" ?selected=${this.idField === ''}>none: number by position</option>
                    ${p.fields.filter((f) => f !== this.textField).map((f) => html`<option value=${f} ?selected=${f === this.idField}>${f}</option>`)}
                  </select></label
                >`
            : nothing}
        </div>
        ${this.sending ? html`<progress max="1" .value=${this.sent} aria-label="Upload progress"></progress>` : nothing}
        <div class="row">
          <button class="primary" type="submit" ?disabled=${this.sending || p.fields.length === 0}>${this.sending ? 'Sending…' : 'Import'}</button>
          <button type="button" @click=${() => (this.sending ? this.abort?.abort() : this.reset())}>${this.sending ? 'Stop' : 'Choose another file'}</button>
        </div>
      </form>
    `;
  }

  private renderResult(r: CorpusCreated) {
    return html`<div class="note info stack" role="status">
      <div><strong>${r.name}</strong>: ${r.documentCount.toLocaleString()} documents imported${r.skipped.length ? html`, ${r.skipped.length.toLocaleString()} line${r.skipped.length === 1 ? '' : 's'} skipped` : nothing}.</div>
      ${r.skipped.length
        ? html`<div class="skipped small">
            <table aria-label="Skipped lines">
              <thead><tr><th scope="col">Line</th><th scope="col">Why it was skipped</th></tr></thead>
              <tbody>${r.skipped.slice(0, SHOWN_SKIPPED).map((s) => html`<tr><td class="num">${s.line}</td><td>${s.reason}</td></tr>`)}</tbody>
            </table>
            ${r.skipped.length > SHOWN_SKIPPED ? html`<p>…and ${r.skipped.length - SHOWN_SKIPPED} more.</p>` : nothing}
          </div>`
        : nothing}
    </div>`;
  }

  override render() {
    return html`
      <section class="panel stack" aria-labelledby="up-h">
        <h3 id="up-h">Add a corpus</h3>
        ${this.preview
          ? this.renderPreview(this.preview)
          : html`<div
              class="drop ${this.dragging ? 'over' : ''}"
              @dragover=${(e: DragEvent) => {
                e.preventDefault();
                this.dragging = true;
              }}
              @dragleave=${() => (this.dragging = false)}
              @drop=${this.onDrop}
            >
              <p>Drop a file here: CSV with a header row, NDJSON, a JSON array, or plain text with one document per line.</p>
              <input id="file" class="visually-hidden" type="file" accept=".csv,.ndjson,.jsonl,.json,.txt,text/*,application/json" @change=${this.onPick} />
              <button type="button" @click=${() => this.renderRoot.querySelector<HTMLInputElement>('#file')?.click()}>Choose a file…</button>
            </div>`}
        <sheaf-error-note .error=${this.error} context="Import failed"></sheaf-error-note>
        ${this.result ? this.renderResult(this.result) : nothing}
      </section>
    `;
  }
}
customElements.define('sheaf-upload', SheafUpload);
