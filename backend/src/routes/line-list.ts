import { Router } from 'express';
import { lineListResponseSchema } from '../contracts/line-list';
import { access } from '../http/access';
import { defineRoute } from '../http/define-route';
import type { ServiceContext } from '../services/context';
import { combLineClasses } from '../spectra/combLineClasses';
import { LINES } from '../spectra/lineList';
import { ENGINE_RECIPES } from '../spectra/templateRecipes';

/** The rest-frame features of the comb, vacuum wavelengths in Å, with their sources and the classes whose templates draw them. */
export function lineListRoutes(ctx: ServiceContext): Router {
  const router = Router();
  const classes = combLineClasses(ENGINE_RECIPES, LINES);
  const lines = LINES.map((l) => ({ name: l.name, species: l.species, rest: l.rest, kind: l.kind, source: l.source, ...(l.widthA ? { widthA: l.widthA } : {}), ...classes.get(l.name)! }));
  defineRoute(ctx, router, {
    method: 'get',
    path: '/line-list',
    access: access.signedIn,
    response: lineListResponseSchema,
    handle: () => ({ medium: 'vacuum', unit: 'Angstrom', lines }),
  });
  return router;
}
