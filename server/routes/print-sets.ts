import express, { type Router } from 'express';
import type { AppContext } from '../app-context';

/** Placeholder until the print engine lands. */
export function printSetsRouter(_ctx: AppContext): Router {
  return express.Router({ mergeParams: true });
}
