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

/** Each check's rule in words, shown where a result has no figures of its own (needs input, not applicable, presence checks). */
export const CHECK_FORMULAS: Readonly<Record<string, string>> = {
  "max-pv-voltage": "Voc × modules in series × cold correction (module coefficient, else Table 690.7(A)) ≤ every rating on the circuit and the building limit",
  "mppt-window": "Vmp × modules in series × (1 + Vmp coefficient × (design high + module rise − 25 °C)) ≥ the input's lowest tracking voltage (and the battery charge voltage + headroom)",
  "circuit-current": "PV: 1.25 × Isc × strings; inverter DC input: continuous W ÷ (lowest battery V × efficiency); AC: the equipment's continuous output",
  "conductor-ampacity": "terminal-column ampacity ≥ 1.25 × current, and table ampacity × ambient correction × adjustment ≥ current",
  "overcurrent-protection": "1.25 × continuous current ≤ device rating ≤ conductor ampacity (next standard size up, 240.4(B); small-conductor limits, 240.4(D))",
  disconnects: "a disconnect or breaker on a circuit of the item, or one built into the equipment",
  grounding: "EGC ≥ Table 250.122 size for the protecting device (for unprotected PV circuits, the device 690.9(B) would require)",
  "voltage-drop": "2 × one-way length × Ω/kft × operating current ÷ 1000 ÷ operating voltage ≤ limit",
  "battery-terminals": "conductors landed on each battery terminal ≤ the number it allows (three by common practice)",
  "inverter-capacity": "continuous W ≥ loads running together; surge W ≥ largest start + other running loads",
  "stand-alone-sizing": "usable storage ÷ daily energy ≥ days of autonomy; array W × sun hours × 0.75 ≥ daily energy",
  labels: "one label per requirement, with the computed values, where the code puts it",
  "storage-siting": "unit and aggregate kWh within the location's limits, spacing, detection, impact protection, listing",
  "stand-alone-supply": "inverter output ≥ largest single load; 120 V-only supply to a 120/240 V panel: warning label, no multiwire branch circuits",
  "rapid-shutdown": "PV circuits on or in a building: a named method and the devices that carry it out",
  "device-ratings": "DC-rated devices at or above the circuit's maximum voltage; interrupting rating ≥ available fault current; listed for the use",
  "panel-busbar": "1.25 × inverter output current + main ≤ 1.2 × bus (or sum of breakers ≤ bus); stand-alone: output device ≤ bus",
  "submittal-completeness": "every document the jurisdiction requires is attached",
};
