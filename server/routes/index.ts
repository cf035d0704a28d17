// The API's routers, in one list. A feature adds its router factory here.
import type { Router } from 'express';
import type { AppDeps } from '../app-deps';
import { userRoutes } from './users.routes';
import { areaRoutes } from './areas.routes';
import { trailRoutes } from './trail.routes';

export type RouteFactory = (deps: AppDeps) => Router;

export const featureRoutes: RouteFactory[] = [userRoutes, areaRoutes, trailRoutes];
