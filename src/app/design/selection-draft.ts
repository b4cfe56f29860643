import { Injectable, computed, effect, linkedSignal, signal } from '@angular/core';
import type {
  DesignDraft,
  DesignSearch,
  DutyBand,
  Project,
  SelectionCandidate,
  SelectionResponse,
} from '../../../shared/api/api-schemas';
import { convertFlow, convertLength } from '../../../shared/hydraulics';
import { convertSystemDraft, exampleDraft, toPipeSystem, type SystemDraft } from './system-draft';
import { unitSystems, type UnitSystem } from './unit-systems';

/** What the designer asks the search for, besides the system and the band (the contract's DesignSearch). */
export type SearchSettings = DesignSearch;

/** The saved project the draft came from or was saved as. */
export interface ProjectRef {
  id: number;
  name: string;
}

interface StoredDraft {
  project: ProjectRef | null;
  unitSystem: UnitSystem;
  system: SystemDraft;
  band: DutyBand;
  search: SearchSettings;
  results: SelectionResponse | null;
  compared: string[];
  /** One-way length of the cable run from the supply to the pump, in the design's length unit; null when not given. */
  cableLength: number | null;
}

/** The draft without the chosen candidates, which follow the results on their own. */
type DraftState = Omit<StoredDraft, 'compared'>;

const storageKey = 'riffle.design-draft.v1';

/** Most candidates one comparison chart shows. */
export const maxCompared = 8;

/** A candidate's key: the same pump in another arrangement is another candidate. */
export function candidateKey(candidate: Pick<SelectionCandidate, 'pumpId' | 'arrangement'>): string {
  return `${candidate.pumpId}x${candidate.arrangement.running}`;
}

function initialDraft(): StoredDraft {
  return {
    project: null,
    unitSystem: 'us',
    system: exampleDraft(),
    band: { flowMin: 90, flowMax: 130 },
    search: {
      arrangements: [1, 2],
      requireOneFailed: true,
      standby: false,
      onlyPreferredRegion: false,
      maxInputPowerPerPump: null,
      hoursPerDay: 24,
      tariffPerKWh: 0.18,
      motorEfficiency: null,
      rankBy: 'energy',
      costs: null,
      limit: 20,
    },
    results: null,
    compared: [],
    cableLength: null,
  };
}

function readStored(): StoredDraft {
  try {
    const text = sessionStorage.getItem(storageKey);
    if (!text) return initialDraft();
    const stored = JSON.parse(text) as Partial<StoredDraft>;
    // an answer kept from before answers stated their energy basis is asked for again
    if (stored.results && !stored.results.energyBasis) stored.results = null;
    return { ...initialDraft(), ...stored };
  } catch {
    return initialDraft();
  }
}

/**
 * The design in progress, shared by the four steps (site and system, flow band, candidates,
 * compare) and kept for the browser tab's session, so a reload or a step back loses nothing.
 */
@Injectable({ providedIn: 'root' })
export class SelectionDraft {
  private readonly restored = readStored();
  private readonly stored = signal<DraftState>(this.restored);

  readonly project = computed(() => this.stored().project);
  /** The design as a project saves it. */
  readonly design = computed((): DesignDraft => {
    const { unitSystem, system, band, search, cableLength } = this.stored();
    return { unitSystem, system, band, search, ...(cableLength === null ? {} : { cableLength }) };
  });
  readonly unitSystem = computed(() => this.stored().unitSystem);
  readonly units = computed(() => unitSystems[this.stored().unitSystem].units);
  readonly system = computed(() => this.stored().system);
  readonly pipeSystem = computed(() => toPipeSystem(this.stored().system));
  readonly band = computed(() => this.stored().band);
  readonly search = computed(() => this.stored().search);
  readonly results = computed(() => this.stored().results);
  readonly cableLength = computed(() => this.stored().cableLength);
  /** The candidates chosen for comparison: the stored choice at start, none again whenever the results change. */
  private readonly chosen = linkedSignal<SelectionResponse | null, string[]>({
    source: this.results,
    computation: (_results, previous) => (previous === undefined ? this.restored.compared : []),
  });
  readonly compared = this.chosen.asReadonly();
  readonly comparedCandidates = computed(() => {
    const keys = new Set(this.compared());
    return (this.results()?.candidates ?? []).filter((candidate) => keys.has(candidateKey(candidate)));
  });

  constructor() {
    effect(() => {
      try {
        const draft: StoredDraft = { ...this.stored(), compared: this.chosen() };
        sessionStorage.setItem(storageKey, JSON.stringify(draft));
      } catch {
        // A full or disabled storage only costs the reload memory.
      }
    });
  }

  /**
   * The same design in other units: the system and the band are converted; the search answered
   * in the old units is dropped, to be run again.
   */
  setUnitSystem(unitSystem: UnitSystem): void {
    if (unitSystem === this.unitSystem()) return;
    const from = this.units();
    const to = unitSystems[unitSystem].units;
    // a band is a design target: four figures say it (90 gpm is 340.7 L/min, and back)
    const flow = (value: number) => Number(convertFlow(value, from.flow, to.flow).toPrecision(4));
    this.stored.update((draft) => ({
      ...draft,
      unitSystem,
      system: convertSystemDraft(draft.system, from, to),
      band: { ...draft.band, flowMin: flow(draft.band.flowMin), flowMax: flow(draft.band.flowMax) },
      cableLength:
        draft.cableLength === null
          ? null
          : Number(convertLength(draft.cableLength, from.length, to.length).toPrecision(4)),
      results: null,
    }));
  }

  /** Opens a saved project: its design replaces the draft, and the search is to run again. */
  openProject(project: Project): void {
    const { unitSystem, system, band, search, cableLength } = project.design;
    this.stored.set({
      project: { id: project.id, name: project.name },
      unitSystem,
      system,
      band,
      search,
      results: null,
      cableLength: cableLength ?? null,
    });
  }

  /** The draft now is the saved project `project`. */
  savedAs(project: Pick<Project, 'id' | 'name'>): void {
    this.stored.update((draft) => ({ ...draft, project: { id: project.id, name: project.name } }));
  }

  /** The saved project is gone (deleted): the draft stays, as an unsaved design. */
  forgetProject(): void {
    this.stored.update((draft) => ({ ...draft, project: null }));
  }

  setSystem(system: SystemDraft): void {
    this.stored.update((draft) => ({ ...draft, system, results: null }));
  }

  setBand(band: DutyBand): void {
    this.stored.update((draft) => ({ ...draft, band, results: null }));
  }

  setSearch(search: SearchSettings): void {
    this.stored.update((draft) => ({ ...draft, search }));
  }

  /** The cable run's one-way length (design units), or null; it changes no search. */
  setCableLength(cableLength: number | null): void {
    this.stored.update((draft) => ({ ...draft, cableLength }));
  }

  setResults(results: SelectionResponse): void {
    this.stored.update((draft) => ({ ...draft, results }));
  }

  toggleCompared(key: string): void {
    this.chosen.update((compared) =>
      compared.includes(key)
        ? compared.filter((existing) => existing !== key)
        : compared.length < maxCompared
          ? [...compared, key]
          : compared,
    );
  }
}
