import type { Project } from '../database/models';
import type { ProposalFacts } from '../database/models/project-report';
import { designUnits, type DesignFigures } from './design-selection';

/** What a proposal says, kept beside its PDF for the client's read-only page: the figures the PDF shows. */
export function proposalFacts(
  project: Project,
  companyName: string,
  clientName: string,
  siteAddress: string,
  figures: DesignFigures,
): ProposalFacts {
  const units = designUnits(project.design);
  const chosen = figures.selection.candidates[0];
  return {
    projectName: project.name,
    companyName,
    clientName,
    siteAddress,
    band: {
      flowMin: project.design.band.flowMin,
      flowMax: project.design.band.flowMax,
      flowUnit: units.flow,
      headMin: figures.headAtBand.min,
      headMax: figures.headAtBand.max,
      headUnit: units.head,
    },
    chosen: chosen
      ? {
          pump: `${chosen.supplier} ${chosen.model} (${chosen.modelCode})`,
          arrangement: { installed: chosen.arrangement.installed, running: chosen.arrangement.running },
          flow: chosen.operatingPoint.flow,
          head: chosen.operatingPoint.head,
          efficiency: chosen.operatingPoint.efficiency,
          annualKWh: chosen.annualKWh,
        }
      : null,
  };
}
