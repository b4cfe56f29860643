import { DESIGN_CAUTIONS } from '../../shared/messages/design-cautions';
import type { ProposalFacts } from '../database/models/project-report';
import { figure } from './proposal-costs';

/*
 * The client's read-only page of a proposal: plain HTML from the server, its styles in the page
 * (allowed by the site's policy for styles from this origin), no scripts, nothing from elsewhere.
 */

const htmlEscapes: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

function escaped(text: string): string {
  return text.replace(/[&<>"']/g, (character) => htmlEscapes[character]);
}

/** Multi-line text (an address) as lines. */
function lines(text: string): string {
  return text
    .split('\n')
    .map((line) => escaped(line))
    .join('<br />');
}

const styles = `
  body { font-family: system-ui, sans-serif; color: #1b2a2f; background: #f6f3ec; margin: 0; line-height: 1.5; }
  main { max-width: 46rem; margin: 0 auto; padding: 1.5rem 1rem 3rem; }
  header { border-bottom: 3px solid #0b5563; margin-bottom: 1rem; }
  h1 { font-size: 1.6rem; margin: 0 0 0.25rem; color: #0b5563; }
  h2 { font-size: 1.15rem; color: #0b5563; margin-top: 1.5rem; }
  .company { font-weight: 700; margin: 0; }
  dl { display: grid; grid-template-columns: max-content 1fr; gap: 0.25rem 1rem; margin: 0; }
  dt { font-weight: 700; }
  dd { margin: 0; }
  .pdf { display: inline-block; margin-top: 1rem; padding: 0.6rem 1.1rem; background: #0b5563; color: #fff;
    border-radius: 0.4rem; text-decoration: none; font-weight: 700; }
  .cautions li { margin-bottom: 0.4rem; }
  .muted { color: #55605f; font-size: 0.9rem; }
`;

function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8" />
<meta name="viewport" content="width=device-width, initial-scale=1" />
<meta name="robots" content="noindex, nofollow" />
<title>${escaped(title)}</title>
<style>${styles}</style>
</head>
<body>
<main>
${body}
</main>
</body>
</html>
`;
}

export interface ClientViewContent {
  projectName: string;
  /** The facts kept with the proposal; null for one made before they were kept. */
  facts: ProposalFacts | null;
  /** The company that made it, when the proposal's facts do not name it. */
  companyName: string;
  madeAt: Date;
  pdfHref: string;
}

function factsList(pairs: ReadonlyArray<readonly [string, string]>): string {
  return `<dl>${pairs.map(([label, value]) => `<dt>${escaped(label)}</dt><dd>${value}</dd>`).join('')}</dl>`;
}

export function clientViewPage(content: ClientViewContent): string {
  const { facts } = content;
  const company = facts?.companyName || content.companyName;
  const parts: string[] = [
    `<header>${company ? `<p class="company">${escaped(company)}</p>` : ''}<h1>Pump proposal: ${escaped(content.projectName)}</h1>` +
      `<p class="muted">Made on ${content.madeAt.toISOString().slice(0, 10)}. This page shows the proposal as it was sent; it cannot be changed here.</p></header>`,
  ];
  if (facts) {
    parts.push(
      '<h2>Client and site</h2>',
      factsList([
        ['Client', facts.clientName ? escaped(facts.clientName) : '-'],
        ['Site', facts.siteAddress ? lines(facts.siteAddress) : '-'],
      ]),
      '<h2>Duty</h2>',
      `<p>The feature needs ${figure(facts.band.flowMin, 1)} to ${figure(facts.band.flowMax, 1)} ${escaped(facts.band.flowUnit)}; ` +
        `the pipework needs ${figure(facts.band.headMin, 2)} to ${figure(facts.band.headMax, 2)} ${escaped(facts.band.headUnit)} of total dynamic head (TDH) over that band.</p>`,
      '<h2>Chosen pump</h2>',
      facts.chosen
        ? factsList([
            ['Pump', escaped(facts.chosen.pump)],
            ['Pumps', `${facts.chosen.arrangement.running} running of ${facts.chosen.arrangement.installed} installed`],
            [
              'Duty point',
              `${figure(facts.chosen.flow, 1)} ${escaped(facts.band.flowUnit)} at ${figure(facts.chosen.head, 2)} ${escaped(facts.band.headUnit)} TDH`,
            ],
            ['Efficiency', facts.chosen.efficiency === null ? '-' : `${figure(facts.chosen.efficiency, 1)} %`],
            ['Energy', facts.chosen.annualKWh === null ? '-' : `${figure(facts.chosen.annualKWh, 0)} kWh per year`],
          ])
        : '<p>No catalog pump met this system in the arrangements asked for.</p>',
    );
  } else {
    parts.push('<p>The figures of this proposal are in its PDF.</p>');
  }
  parts.push(
    `<p><a class="pdf" href="${escaped(content.pdfHref)}">Open the proposal (PDF)</a></p>`,
    '<h2>Cautions</h2>',
    `<ul class="cautions">${DESIGN_CAUTIONS.map((caution) => `<li><strong>${escaped(caution.title)}</strong> ${escaped(caution.text)}</li>`).join('')}</ul>`,
  );
  return page(`Pump proposal: ${content.projectName}`, parts.join('\n'));
}

/** The page a browser is shown for a link that is unknown (404) or no longer open (410). */
export function clientViewProblemPage(title: string, detail: string | undefined): string {
  return page(title, `<header><h1>${escaped(title)}</h1></header><p>${escaped(detail ?? '')}</p>`);
}
