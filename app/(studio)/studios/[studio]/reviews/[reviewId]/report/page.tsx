import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { pageAccess } from '@/lib/auth/page-access';
import { ProblemError } from '@/lib/errors';
import { buildAccuracyReport } from '@/lib/reviews/report';
import { reviewDetail } from '@/lib/reviews/service';
import { sceneWorldline } from '@/lib/scenes/readout';
import { sceneTiming } from '@/lib/scenes/frame-request';
import { getRevision } from '@/lib/scenes/service';
import type { SceneSpec } from '@/lib/scenes/schema';
import { sampleTimeline } from '@/components/scenes/analysis/timeline';
import { formatDuration, formatNumber, formatScreenTime } from '@/components/scenes/editor/format';
import { Alert } from '@/components/ui/alert';
import { frameUrl, reviewFrameSize } from '@/components/reviews/frame-url';
import { StateBadge } from '@/components/reviews/state-badge';
import { ReportCharts } from '@/components/reviews/report/report-charts';
import { MomentFigures, ReportSection, SegmentTable } from '@/components/reviews/report/report-parts';
import { PrintButton } from '@/components/reviews/report/print-button';
import type { ReviewState } from '@/components/reviews/types';
import '@/components/reviews/report/report-print.css';

export const metadata: Metadata = { title: 'Accuracy report' };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
/** Samples of the shot for the charts. */
const CHART_SAMPLES = 120;
/** Side of the report's frames, px (small: they render on the server while the page loads). */
const REPORT_FRAME_SIDE_PX = 300;

function orNotFound(error: unknown): never {
  if (error instanceof ProblemError && error.status === 404) notFound();
  throw error;
}

/**
 * The accuracy report of the reviewed revision: the path, frames with and
 * without the bending of light at the key moments, the numbers to check
 * there, the engine's published checks run live, every non-physical setting
 * and the model's idealisations. Printable to PDF from the browser.
 */
export default async function AccuracyReportPage({ params }: { params: Promise<{ studio: string; reviewId: string }> }) {
  const { studio, reviewId } = await params;
  const { access, forbidden } = await pageAccess(studio, 'reviews.read');
  if (forbidden) return <Alert tone="info" testId="forbidden">The accuracy report is for producers and advisors.</Alert>;
  if (!UUID.test(reviewId)) notFound();
  const detail = await reviewDetail(access!.studio.id, reviewId).catch(orNotFound);
  const { review } = detail;
  const revision = await getRevision(access!.studio.id, review.sceneId, review.revision).catch(orNotFound);
  const spec = revision.spec as SceneSpec;
  const report = buildAccuracyReport(spec);
  const worldline = sceneWorldline(spec);
  const points = sampleTimeline(spec, worldline, sceneTiming(spec, worldline), CHART_SAMPLES);
  const size = reviewFrameSize(spec.projection.kind, REPORT_FRAME_SIDE_PX);
  const failed = report.checks.filter((c) => !c.passed);
  const pinned = detail.notes.filter((n) => n.parentId === null);

  return (
    <article className="max-w-5xl space-y-6" data-report data-testid="accuracy-report">
      <div className="space-y-2">
        <div className="no-print flex items-center gap-3 text-sm">
          <Link href={`/studios/${studio}/reviews/${reviewId}`} className="text-teal-300 hover:underline" data-testid="back-to-review">← Back to the review</Link>
          <span className="ml-auto"><PrintButton /></span>
        </div>
        <p className="muted text-xs uppercase tracking-widest text-slate-500">Skywell accuracy report · {access!.studio.name}</p>
        <h1 className="text-2xl font-semibold" data-testid="report-title">{review.sceneName} · revision {review.revision}</h1>
        <div className="flex flex-wrap items-center gap-3 text-sm text-slate-300">
          <StateBadge state={review.state as ReviewState} />
          <span>content hash <code className="font-mono text-xs">{revision.contentHash.slice(0, 16)}</code></span>
          <span>hole of {formatNumber(spec.massSolar, 4)} solar masses (M = {formatDuration(report.secondsPerM)})</span>
          <span>path {formatDuration(report.pathDurationM * report.secondsPerM)} of the traveller&apos;s time, shown in {formatScreenTime(report.screenEndS - report.screenStartS)} of screen time</span>
        </div>
        <p className="muted max-w-3xl text-sm text-slate-400">
          This report lists what the audience will see and the numbers behind it, so a scientific advisor can check them and a producer can explain them. Everything here is computed from this exact revision; any edit makes a new revision with its own report.
        </p>
        <p className={failed.length ? 'text-sm text-danger-400' : 'text-sm text-teal-300'} data-testid="checks-summary">
          {failed.length ? `${failed.length} of ${report.checks.length} published checks FAILED: see section 4.` : `The engine passes all ${report.checks.length} published checks (section 4).`}
        </p>
      </div>

      <ReportSection title="1. The path" testId="report-path" lead="Where the camera goes and how fast its clock runs against the show's clock. Radii are in Schwarzschild radii (r_s; the event horizon is at 1 r_s, the photon sphere at 1.5, the innermost stable orbit at 3).">
        <SegmentTable report={report} />
        <div className="max-w-[680px]"><ReportCharts points={points} /></div>
      </ReportSection>

      <ReportSection title="2. Key moments" testId="report-moments" lead="Frames at the start of the path, at each joint between segments, at the horizon crossing and at the end, each beside the same view with the bending of light switched off, with the numbers to check there.">
        <div className="space-y-6">
          {report.moments.map((item) => (
            <div key={`${item.moment.kind}-${item.moment.tauM}`} className="avoid-break space-y-3 border-t border-ink-700 pt-4 first:border-0 first:pt-0" data-testid="key-moment" data-kind={item.moment.kind}>
              <h3 className="font-medium text-slate-100">
                {item.moment.label} <span className="muted text-sm font-normal text-slate-400">· screen {formatScreenTime(item.screenTimeS)} · proper time {formatDuration(item.readout.tauSeconds)} ({formatNumber(item.moment.tauM, 6)} M)</span>
              </h3>
              <div className="space-y-3">
                <div className="grid max-w-3xl grid-cols-2 gap-3">
                  {[true, false].map((lensing) => (
                    <figure key={String(lensing)} className="space-y-1">
                      {/* eslint-disable-next-line @next/next/no-img-element -- server-rendered PNG from our frame route */}
                      <img src={frameUrl(studio, review.sceneId, review.revision, item.moment.tauM, size, lensing)} width={size.width} height={size.height} alt={`${item.moment.label}, ${lensing ? 'as rendered' : 'bending of light off'}`} className="keep-colour w-full rounded border border-ink-700 bg-black" data-testid={lensing ? 'moment-frame-lensed' : 'moment-frame-unlensed'} />
                      <figcaption className="muted text-xs text-slate-400">{lensing ? 'As rendered' : 'Same view, bending of light switched off'}</figcaption>
                    </figure>
                  ))}
                </div>
                <MomentFigures item={item} massSolar={spec.massSolar} />
              </div>
            </div>
          ))}
        </div>
      </ReportSection>

      <ReportSection title="3. Settings that are not physics" testId="report-settings" lead="Every choice in force that changes the picture for artistic or practical reasons. Each is deliberate and recorded with the frames.">
        <ul className="space-y-2 text-sm" data-testid="non-physical-list">
          {report.nonPhysical.map((s) => (
            <li key={s.setting}><span className="font-medium text-slate-100">{s.setting}.</span> <span className="text-slate-300">{s.plainWords}</span></li>
          ))}
        </ul>
      </ReportSection>

      <ReportSection title="4. Published checks the engine passes" testId="report-checks" lead="Textbook and journal values, recomputed live by the engine for this report with the same code the automated tests run.">
        <table className="w-full text-left text-sm" data-testid="checks-table">
          <thead className="text-xs uppercase tracking-wider text-slate-500">
            <tr><th className="py-1.5 pr-3 font-medium">Check</th><th className="py-1.5 pr-3 font-medium">Published</th><th className="py-1.5 pr-3 font-medium">Engine</th><th className="py-1.5 pr-3 font-medium">Gap</th><th className="py-1.5 pr-3 font-medium">Allowed gap</th><th className="py-1.5 font-medium">Result</th></tr>
          </thead>
          <tbody>
            {report.checks.map((c) => (
              <tr key={c.id} className="border-t border-ink-700 align-top" data-testid="check-row" data-passed={c.passed}>
                <td className="py-1.5 pr-3">
                  <p className="text-slate-100">{c.title}</p>
                  <p className="muted text-xs text-slate-400">{c.plainWords}</p>
                  <p className="muted text-[11px] text-slate-500">{c.source}</p>
                </td>
                <td className="py-1.5 pr-3 tabular-nums">{formatNumber(c.published, 8)} {c.unit}</td>
                <td className="py-1.5 pr-3 tabular-nums">{formatNumber(c.computed, 8)} {c.unit}</td>
                <td className="py-1.5 pr-3 tabular-nums">{Number.isFinite(c.error) ? c.error.toExponential(1) : '–'}</td>
                <td className="py-1.5 pr-3 tabular-nums" title={c.toleranceWhy}>{c.tolerance.toExponential(1)}</td>
                <td className={`py-1.5 font-medium ${c.passed ? 'text-teal-300' : 'text-danger-400'}`}>{c.passed ? 'pass' : 'FAIL'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </ReportSection>

      <ReportSection title="5. What the model leaves out" testId="report-idealisations" lead="The simplifications behind every picture in this show, in words to use with the audience.">
        <ul className="space-y-3 text-sm">
          {report.idealisations.map((i) => (
            <li key={i.title}><p className="font-medium text-slate-100">{i.title}</p><p className="text-slate-300">{i.plainWords}</p></li>
          ))}
        </ul>
      </ReportSection>

      <ReportSection title="6. Review notes" testId="report-notes">
        {pinned.length === 0 ? <p className="text-sm text-slate-400">No notes on this review.</p> : (
          <ul className="space-y-2 text-sm">
            {pinned.map((n) => (
              <li key={n.id}><span className="tabular-nums text-slate-400">{n.tau === null ? '' : `${formatDuration(n.tau * report.secondsPerM)} proper time · `}{n.status}</span> — <span className="whitespace-pre-wrap text-slate-200">{n.body}</span></li>
            ))}
          </ul>
        )}
      </ReportSection>
    </article>
  );
}
