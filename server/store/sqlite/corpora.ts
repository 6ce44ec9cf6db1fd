import type { CorpusRecord, DocumentPage, DocumentQuery, DocumentRecord } from '../api.js';
import { newId } from '../new-id.js';
import { statementCache, type Db } from './open-database.js';

interface CorpusRow {
  id: string;
  name: string;
  document_count: number;
  fields: string;
  created_at: string;
}

function toCorpus(r: CorpusRow): CorpusRecord {
  return { id: r.id, name: r.name, documentCount: r.document_count, createdAt: r.created_at, fields: JSON.parse(r.fields) };
}

const ROWS_PER_INSERT = 50;

/** SQLite implementation of the corpus half of the store. */
export class SqliteCorpora {
  private readonly q: ReturnType<typeof statementCache>;

  constructor(private readonly db: Db) {
    this.q = statementCache(db);
    // Leftovers of imports interrupted by a crash: never visible, removed at start.
    db.prepare('DELETE FROM corpora WHERE ready = 0').run();
  }

  async importCorpus(name: string, batches: AsyncIterable<DocumentRecord[]>, fields: () => string[]): Promise<CorpusRecord> {
    const id = newId('c');
    const createdAt = new Date().toISOString();
    this.q('INSERT INTO corpora (id, name, created_at, ready) VALUES (?, ?, ?, 0)').run(id, name, createdAt);
    // Rows go in ROWS_PER_INSERT at a time: one statement per row costs more in binding than in writing.
    const insertOne = this.q('INSERT INTO documents (corpus_id, ord, doc_id, text, meta) VALUES (?, ?, ?, ?, ?)');
    const insertMany = this.q(`INSERT INTO documents (corpus_id, ord, doc_id, text, meta) VALUES ${Array(ROWS_PER_INSERT).fill('(?, ?, ?, ?, ?)').join(', ')}`);
    let ord = 0;
    const args: unknown[] = [];
    const writeBatch = this.db.transaction((docs: DocumentRecord[]) => {
      let i = 0;
      for (; i + ROWS_PER_INSERT <= docs.length; i += ROWS_PER_INSERT) {
        args.length = 0;
        for (let j = i; j < i + ROWS_PER_INSERT; j++) args.push(id, ord++, docs[j].id, docs[j].text, JSON.stringify(docs[j].meta));
        insertMany.run(args);
      }
      for (; i < docs.length; i++) insertOne.run(id, ord++, docs[i].id, docs[i].text, JSON.stringify(docs[i].meta));
    });
    try {
      for await (const batch of batches) {
        try {
          writeBatch(batch);
        } catch (e) {
          if ((e as { code?: string }).code === 'SQLITE_CONSTRAINT_UNIQUE') {
            throw new DuplicateIdError();
          }
          throw e;
        }
      }
      this.q('UPDATE corpora SET ready = 1, document_count = ?, fields = ? WHERE id = ?')
        .run(ord, JSON.stringify(fields()), id);
    } catch (e) {
      this.q('DELETE FROM corpora WHERE id = ?').run(id);
      throw e;
    }
    return { id, name, documentCount: ord, createdAt, fields: fields() };
  }

  async listCorpora(): Promise<CorpusRecord[]> {
    const rows = this.q('SELECT * FROM corpora WHERE ready = 1 ORDER BY created_at, id').all() as CorpusRow[];
    return rows.map(toCorpus);
  }

  async getCorpus(id: string): Promise<CorpusRecord | null> {
    const row = this.q('SELECT * FROM corpora WHERE id = ? AND ready = 1').get(id) as CorpusRow | undefined;
    return row ? toCorpus(row) : null;
  }

  async deleteCorpus(id: string): Promise<boolean> {
    return this.q('DELETE FROM corpora WHERE id = ? AND ready = 1').run(id).changes > 0;
  }

  async listDocuments(corpusId: string, query: DocumentQuery): Promise<DocumentPage> {
    const q = query.q?.trim();
    const where = q ? "corpus_id = ? AND text LIKE ? ESCAPE '\\'" : 'corpus_id = ?';
    const args: unknown[] = q ? [corpusId, `%${q.replace(/[\\%_]/g, (m) => '\\' + m)}%`] : [corpusId];
    const total = (this.q(`SELECT count(*) AS n FROM documents WHERE ${where}`).get(...args) as { n: number }).n;
    const rows = this.q(`SELECT doc_id, text, meta FROM documents WHERE ${where} ORDER BY ord LIMIT ? OFFSET ?`)
      .all(...args, query.limit, query.offset) as { doc_id: string; text: string; meta: string }[];
    return { total, items: rows.map((r) => ({ id: r.doc_id, text: r.text, meta: JSON.parse(r.meta) })) };
  }

  async loadDocumentIds(corpusId: string): Promise<string[]> {
    return this.q('SELECT doc_id FROM documents WHERE corpus_id = ? ORDER BY ord').pluck().all(corpusId) as string[];
  }

  async loadDocuments(corpusId: string): Promise<DocumentRecord[]> {
    const rows = this.q('SELECT doc_id, text, meta FROM documents WHERE corpus_id = ? ORDER BY ord')
      .all(corpusId) as { doc_id: string; text: string; meta: string }[];
    return rows.map((r) => ({ id: r.doc_id, text: r.text, meta: JSON.parse(r.meta) }));
  }
}

/** Two documents of one upload share an id. */
export class DuplicateIdError extends Error {
  constructor() {
    super('Two documents in the upload have the same id; ids must be unique within a corpus.');
    this.name = 'DuplicateIdError';
  }
}
