import { Panel } from '@/components/ui/panel';

/** The standing cautions for shows made here (product.md, Cautions); venue policy decides. */
export function ViewerCautions() {
  return (
    <Panel title="Before a show reaches an audience">
      <ul className="list-disc space-y-2 pl-5 text-sm text-slate-300">
        <li>
          <strong className="text-violet-300">Photosensitivity.</strong> Frame sequences are checked for rapid large brightness changes and saturated-red
          flashes (WCAG 2.2 success criterion 2.3.1, ITU-R BT.1702). The check informs; your venue&apos;s policy and local rules decide what may be shown.
        </li>
        <li>
          <strong className="text-violet-300">Dome motion comfort.</strong> Fast camera rotation on a dome can cause discomfort. Skywell warns above an
          angular-speed limit (common practice, no single source); follow your venue&apos;s guidance for audiences.
        </li>
        <li>
          <strong className="text-violet-300">Scientific idealisations.</strong> The hole is eternal, isolated and non-spinning; light from the far side exists
          only in that eternal solution. Advisors see these in each accuracy report.
        </li>
      </ul>
    </Panel>
  );
}
