/**
 * The check catalogue, in the order results are listed within a status. Each definition carries everything the
 * product shows about it (title, rule in words, what it cites when nothing applies), so adding a check is one
 * file and one line here.
 */
import { batteryTerminals } from "./checks/battery-terminals";
import { circuitCurrentCheck } from "./checks/circuit-current";
import { conductorAmpacityCheck } from "./checks/conductor-ampacity";
import { deviceRatings } from "./checks/device-ratings";
import { disconnects } from "./checks/disconnects";
import { grounding } from "./checks/grounding";
import { generatorDisconnects } from "./checks/generator-disconnects";
import { groundingElectrode } from "./checks/grounding-electrode";
import { inverterCapacity } from "./checks/inverter-capacity";
import { labelsRequired } from "./checks/labels-required";
import { maxPvVoltage } from "./checks/max-pv-voltage";
import { mpptWindow } from "./checks/mppt-window";
import { overcurrentProtection } from "./checks/overcurrent-protection";
import { panelBusbar } from "./checks/panel-busbar";
import { pvArcFault } from "./checks/pv-arc-fault";
import { pvGrounding } from "./checks/pv-grounding";
import { pvWiringMethods } from "./checks/pv-wiring-methods";
import { rapidShutdown } from "./checks/rapid-shutdown";
import { standAloneOutput } from "./checks/stand-alone-output";
import { standAloneSizing } from "./checks/stand-alone-sizing";
import { standAloneSupply } from "./checks/stand-alone-supply";
import { storageSiting } from "./checks/storage-siting";
import { submittalCompleteness } from "./checks/submittal-completeness";
import { voltageDrop } from "./checks/voltage-drop";
import { wiringMethodLocation } from "./checks/wiring-method-location";
import type { CheckDefinition } from "./result";

export const CHECKS: readonly CheckDefinition[] = [
  maxPvVoltage,
  mpptWindow,
  circuitCurrentCheck,
  conductorAmpacityCheck,
  overcurrentProtection,
  disconnects,
  grounding,
  groundingElectrode,
  voltageDrop,
  batteryTerminals,
  inverterCapacity,
  standAloneSizing,
  labelsRequired,
  storageSiting,
  standAloneSupply,
  standAloneOutput,
  generatorDisconnects,
  rapidShutdown,
  pvArcFault,
  pvGrounding,
  pvWiringMethods,
  wiringMethodLocation,
  deviceRatings,
  panelBusbar,
  submittalCompleteness,
];
