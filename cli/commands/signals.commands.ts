import type { CliCommand } from '../command';
import {
  aberration,
  aberrationInputSchema,
  channelInputSchema,
  cusum,
  cusumInputSchema,
  endemicChannel,
  type AberrationInput,
  type ChannelInput,
  type CusumInput,
} from '../../shared/signals';

// Case-signal commands (channel, aberration, cusum). Formulas and sources: docs/signals.md.

const channelCommand: CliCommand<ChannelInput> = {
  name: 'channel',
  summary: 'Endemic channel {lower, centre, upper} of one week from the same week in prior seasons',
  input: channelInputSchema,
  run: ({ method, history }) => endemicChannel(method, history),
};

const aberrationCommand: CliCommand<AberrationInput> = {
  name: 'aberration',
  summary: 'Aberration test C1, C2 or C3 on a weekly series: {statistic, alarm} per week',
  input: aberrationInputSchema,
  run: ({ method, series, sdFloor }) => aberration(method, series, { sdFloor }),
};

const cusumCommand: CliCommand<CusumInput> = {
  name: 'cusum',
  summary: 'Upper CUSUM of a weekly series against mean, sd, k and h: {statistic, alarm} per week',
  input: cusumInputSchema,
  run: (input) => cusum(input),
};

export const signalCommands: CliCommand[] = [channelCommand, aberrationCommand, cusumCommand];
