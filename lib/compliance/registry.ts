/** The check catalogue, in the order results are listed within a status. Adding a check is one line. */
import { circuitCurrentCheck } from "./checks/circuit-current";
import { conductorAmpacityCheck } from "./checks/conductor-ampacity";
import { maxPvVoltage } from "./checks/max-pv-voltage";
import { mpptWindow } from "./checks/mppt-window";
import { overcurrentProtection } from "./checks/overcurrent-protection";
import type { CheckDefinition } from "./result";

export const CHECKS: readonly CheckDefinition[] = [
  maxPvVoltage,
  mpptWindow,
  circuitCurrentCheck,
  conductorAmpacityCheck,
  overcurrentProtection,
];
