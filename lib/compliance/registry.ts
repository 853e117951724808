/** The check catalogue, in the order results are listed within a status. Adding a check is one line. */
import { batteryTerminals } from "./checks/battery-terminals";
import { circuitCurrentCheck } from "./checks/circuit-current";
import { conductorAmpacityCheck } from "./checks/conductor-ampacity";
import { deviceRatings } from "./checks/device-ratings";
import { disconnects } from "./checks/disconnects";
import { grounding } from "./checks/grounding";
import { inverterCapacity } from "./checks/inverter-capacity";
import { labelsRequired } from "./checks/labels-required";
import { maxPvVoltage } from "./checks/max-pv-voltage";
import { mpptWindow } from "./checks/mppt-window";
import { overcurrentProtection } from "./checks/overcurrent-protection";
import { panelBusbar } from "./checks/panel-busbar";
import { rapidShutdown } from "./checks/rapid-shutdown";
import { standAloneSizing } from "./checks/stand-alone-sizing";
import { standAloneSupply } from "./checks/stand-alone-supply";
import { storageSiting } from "./checks/storage-siting";
import { submittalCompleteness } from "./checks/submittal-completeness";
import { voltageDrop } from "./checks/voltage-drop";
import type { CheckDefinition } from "./result";
import type { CodeTopic } from "./tables";

export const CHECKS: readonly CheckDefinition[] = [
  maxPvVoltage,
  mpptWindow,
  circuitCurrentCheck,
  conductorAmpacityCheck,
  overcurrentProtection,
  disconnects,
  grounding,
  voltageDrop,
  batteryTerminals,
  inverterCapacity,
  standAloneSizing,
  labelsRequired,
  storageSiting,
  standAloneSupply,
  rapidShutdown,
  deviceRatings,
  panelBusbar,
  submittalCompleteness,
];

/** What each check cites when the record holds nothing it applies to (it then reports "not applicable", never nothing). */
export const SCOPE_TOPIC: Readonly<Record<string, CodeTopic>> = {
  "max-pv-voltage": "max-voltage",
  "mppt-window": "listing-use",
  "circuit-current": "pv-circuit-current",
  "conductor-ampacity": "ampacity-table",
  "overcurrent-protection": "pv-ocpd",
  disconnects: "pv-disconnect",
  grounding: "egc-table",
  "voltage-drop": "voltage-drop",
  "battery-terminals": "terminal-rating",
  "inverter-capacity": "stand-alone-supply",
  "stand-alone-sizing": "stand-alone-supply",
  labels: "field-marking",
  "storage-siting": "ess-listing",
  "stand-alone-supply": "stand-alone-supply",
  "rapid-shutdown": "rapid-shutdown",
  "device-ratings": "listing-use",
  "panel-busbar": "busbar",
  "submittal-completeness": "listing-use",
};
