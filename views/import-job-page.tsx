/** @jsxImportSource hono/jsx */
import type { ImportJob } from '../src/io/import-jobs.ts';
import type { SessionUser } from '../src/web/context.ts';
import { Layout } from './layout.tsx';

const count = (n: number) => n.toLocaleString('en');

/**
 * Where an import stands. While it runs, htmx fetches this panel again every second; once it
 * has finished the panel carries no trigger, so the polling stops.
 */
export function ImportProgressPanel({ job }: { job: ImportJob }) {
  const running = job.state === 'running';
  const { progress } = job;
  const poll = running ? { 'hx-get': `/batches/imports/${job.id}/progress`, 'hx-trigger': 'every 1s', 'hx-swap': 'outerHTML' } : {};
  return (
    <section id="import-progress" class="import-progress" aria-live="polite" {...poll}>
      {running && progress.phase === 'checking' && <p>{`Checking every line of ${job.fileName}: ${count(progress.done)} prompts read so far. Nothing is stored until every line is good.`}</p>}
      {running && progress.phase === 'storing' && progress.total !== null && (
        <>
          <label for="import-bar">{`Storing and scoring: ${count(progress.done)} of ${count(progress.total)} prompts`}</label>
          <progress id="import-bar" max={progress.total} value={progress.done}>{`${Math.round((100 * progress.done) / Math.max(1, progress.total))}%`}</progress>
        </>
      )}
      {running && <p class="muted">This page updates itself; you may also leave it — the import goes on. <a href={`/batches/imports/${job.id}`}>Check again</a></p>}
      {job.state === 'done' && job.result && (
        <div class="notice" role="status">
          <p>{`Imported "${job.batchName}": ${count(job.result.items)} prompts and ${count(job.result.responses)} responses, scored.`}</p>
          <p><a href={`/?batch=${job.result.batchId}`}>Open its queue</a> · <a href="/batches">All batches</a></p>
        </div>
      )}
      {(job.state === 'refused' || job.state === 'failed') && (
        <div class="error-box" role="alert">
          <p>{job.error}</p>
          {job.problems && <ul>{job.problems.slice(0, 200).map((p) => <li>{`line ${p.line}${p.field ? `, ${p.field}` : ''}: ${p.message}`}</li>)}</ul>}
          {job.problems && job.problems.length > 200 && <p>{`… and ${count(job.problems.length - 200)} more. The CLI (plumbline import) lists them all.`}</p>}
          <p><a href="/batches">Back to the batches</a></p>
        </div>
      )}
    </section>
  );
}

export function ImportJobPage(props: { user: SessionUser; csrfToken: string; job: ImportJob }) {
  return (
    <Layout title={`Import: ${props.job.batchName}`} user={props.user} csrfToken={props.csrfToken}>
      <h1>{`Import: ${props.job.batchName}`}</h1>
      <p class="muted">{`From ${props.job.fileName}. Scores are triage aids, not verdicts; the file may hold harmful text and personal data.`}</p>
      <ImportProgressPanel job={props.job} />
    </Layout>
  );
}
