import type { SurveyBody, SurveyDto } from '../../../shared/api/surveys.schema';
import { surveyDto } from '../../../shared/api/surveys.schema';
import { errorFromResponse } from '../../lib/api-client';

/**
 * The offline-first outbox of larval surveys. A survey is written to the browser's storage (localStorage)
 * before anything is sent, and leaves it only when the server has accepted it (201 the first time, 200
 * when it already had that id). The id is made in the browser when the survey is saved, so sending it
 * again — after a lost answer, a reload or a second tab — never stores it twice. A survey the server
 * refuses (400/403/409) stays in the outbox with the reason, for the user to fix or discard: nothing is
 * lost silently. Hand-written (about a hundred lines) because the product needs only this one queue;
 * a general offline-sync library would bring a service worker and a schema of its own.
 */

export const OUTBOX_KEY = 'broodcast.surveys.outbox.v1';

/**
 * What one outbox carries: where it keeps its items, where it sends them and how it reads the answer.
 * The surveys and the Field log's records (issue 19) are two outboxes of this one queue.
 */
export interface OutboxConfig<D> {
  storageKey: string;
  url: string;
  dto: { safeParse(value: unknown): { success: true; data: D } | { success: false } };
}

const SURVEYS: OutboxConfig<SurveyDto> = { storageKey: OUTBOX_KEY, url: '/api/surveys', dto: surveyDto };

export type OutboxItem<B extends { id: string } = SurveyBody> = {
  /** The body to send. Named `survey` since surveys were the first to use the queue; kept so outboxes already on devices still read. */
  survey: B;
  queuedAt: string;
  attempts: number;
  /**
   * Why the last attempt failed: `offline` (try again later) or `refused` (the server said no). `code`
   * says which "not sent yet" case it is, so the screen words it in the interface language; `message`
   * is the English text (and the server's own words for `server` and `refused`).
   */
  problem: {
    kind: 'offline' | 'refused';
    code?: 'no-connection' | 'sign-in' | 'server';
    message: string;
    fields?: { path: string; message: string }[];
  } | null;
};

export type FlushResult<D = SurveyDto> = { sent: D[]; kept: number };

type Storage = Pick<globalThis.Storage, 'getItem' | 'setItem'>;
type Fetch = typeof fetch;

export class Outbox<B extends { id: string }, D> {
  private flushing: Promise<FlushResult<D>> | null = null;
  private readonly listeners = new Set<() => void>();

  constructor(
    readonly config: OutboxConfig<D>,
    private readonly storage: Storage = globalThis.localStorage,
    private readonly fetchFn: Fetch = (...args) => globalThis.fetch(...args),
  ) {}

  items(): OutboxItem<B>[] {
    try {
      const raw = this.storage.getItem(this.config.storageKey);
      const parsed = raw ? (JSON.parse(raw) as OutboxItem<B>[]) : [];
      return Array.isArray(parsed) ? parsed : [];
    } catch {
      return [];
    }
  }

  private write(items: OutboxItem<B>[]) {
    this.storage.setItem(this.config.storageKey, JSON.stringify(items));
    for (const l of this.listeners) l();
  }

  subscribe(listener: () => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /** Keep a survey (before any network). Adding the same id twice keeps one copy, the newer. */
  add(survey: B): void {
    const others = this.items().filter((i) => i.survey.id !== survey.id);
    this.write([...others, { survey, queuedAt: new Date().toISOString(), attempts: 0, problem: null }]);
  }

  discard(id: string): void {
    this.write(this.items().filter((i) => i.survey.id !== id));
  }

  /**
   * Send every kept survey, oldest first. One flush at a time: a second call while one runs gets the
   * same promise, so an `online` event and a button press never send a survey twice at once.
   */
  flush(): Promise<FlushResult<D>> {
    this.flushing ??= this.run().finally(() => {
      this.flushing = null;
    });
    return this.flushing;
  }

  private async run(): Promise<FlushResult<D>> {
    const sent: D[] = [];
    for (const item of this.items()) {
      const id = item.survey.id;
      const update = (problem: OutboxItem<B>['problem']) =>
        this.write(this.items().map((i) => (i.survey.id === id ? { ...i, attempts: i.attempts + 1, problem } : i)));
      let response: Response;
      try {
        response = await this.fetchFn(this.config.url, {
          method: 'POST',
          headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
          body: JSON.stringify(item.survey),
          credentials: 'same-origin',
        });
      } catch {
        update({ kind: 'offline', code: 'no-connection', message: 'Not sent yet: no connection. It will be sent when the browser is back online.' });
        break; // no point trying the rest while offline
      }
      if (response.status === 200 || response.status === 201) {
        const parsed = this.config.dto.safeParse(await response.json().catch(() => null));
        this.write(this.items().filter((i) => i.survey.id !== id));
        if (parsed.success) sent.push(parsed.data);
        continue;
      }
      const error = await errorFromResponse(response);
      if (response.status === 401 || response.status >= 500 || response.status === 0) {
        update(
          response.status === 401
            ? { kind: 'offline', code: 'sign-in', message: 'Not sent yet: sign in again to send it.' }
            : { kind: 'offline', code: 'server', message: error.message },
        );
        break;
      }
      update({ kind: 'refused', message: error.message, fields: error.fields });
    }
    return { sent, kept: this.items().length };
  }
}

/** The outbox of larval surveys. */
export class SurveyOutbox extends Outbox<SurveyBody, SurveyDto> {
  constructor(storage?: Storage, fetchFn?: Fetch) {
    super(SURVEYS, storage, fetchFn);
  }
}

let shared: SurveyOutbox | null = null;
/** The browser's outbox of surveys. */
export const surveyOutbox = () => (shared ??= new SurveyOutbox());
