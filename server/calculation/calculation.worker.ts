/**
 * Worker thread of server/calculation/offThread.ts: answers calculation API requests with
 * ./answers.ts (the zod schemas, lib/electrical, the wire numbers), off the request thread.
 */
import { serveTasks } from '@/server/threads/serve';
import { answerCalculation, type CalculationAnswer, type CalculationTask } from './answers';

serveTasks<CalculationTask, CalculationAnswer>(answerCalculation);
