import type { CliCommand } from '../command';
import { signalCommands } from './signals.commands';
import { degreeDaysCommand } from './degree-days.command';
import { dayLengthCommand } from './daylength.command';
import { epiWeekCommand } from './epiweek.command';
import { eipCommand } from './eip.command';
import { seasonCommand } from './season.command';
import { fitNbCommand } from './fit-nb.command';

/** Season-model commands. */
export const modelCommands: CliCommand[] = [degreeDaysCommand, dayLengthCommand, epiWeekCommand, eipCommand, seasonCommand];

/** Every command of `npm run --silent model -- <command>`, including the case-signal commands. */
export const commands: CliCommand[] = [...modelCommands, ...signalCommands, fitNbCommand];
