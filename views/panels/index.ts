/**
 * The workbench panels, in page order. Input panels render into the design form (left column), result panels
 * beside the verdict (right column). To add a panel: create views/panels/<name>.ts exporting a `Panel`, import it
 * here and add it to the list (one line each). See DEVELOPERS.md, "Workbench panels".
 */
import { brakesPanel } from './brakes.ts';
import { casesInputsPanel } from './cases-inputs.ts';
import { checksPanel } from './checks.ts';
import { chartsPanel } from './charts.ts';
import { conversionPanel } from './conversion.ts';
import { conversionInputsPanel } from './conversion-inputs.ts';
import { hardwarePanel, pitfallsPanel } from './hardware.ts';
import { hydraulicsPanel } from './hydraulics.ts';
import { limitsInputsPanel, limitsPanel } from './limits.ts';
import { loadStatesPanel } from './load-states.ts';
import { parkingBrakePanel } from './parking-brake.ts';
import { sizingInputsPanel, sizingPanel } from './sizing.ts';
import { storeInputsPanel, storePanel } from './store.ts';
import type { Panel } from './panel.ts';
import { surfacesPanel } from './surfaces.ts';
import { tablePanel } from './table.ts';
import { testResultsPanel } from './test-results.ts';
import { verdictPanel } from './verdict.ts';
import { vehiclePanel } from './vehicle.ts';

export type { InputContext, Panel, ResultContext } from './panel.ts';

export const panels: Panel[] = [
  vehiclePanel,
  loadStatesPanel,
  brakesPanel,
  hydraulicsPanel,
  parkingBrakePanel,
  surfacesPanel,
  verdictPanel,
  chartsPanel,
  checksPanel,
  pitfallsPanel,
  tablePanel,
  conversionInputsPanel,
  conversionPanel,
  hardwarePanel,
  limitsInputsPanel,
  limitsPanel,
  casesInputsPanel,
  sizingInputsPanel,
  sizingPanel,
  testResultsPanel,
  storeInputsPanel,
  storePanel,
];
