// The API's routers, in one list. A feature adds its router factory here.
import type { Router } from 'express';
import type { AppDeps } from '../app-deps';
import { userRoutes } from './users.routes';
import { areaRoutes } from './areas.routes';
import { trailRoutes } from './trail.routes';
import { organisationRoutes } from './organisation.routes';
import { evidenceRoutes } from './evidence.routes';
import { mailboxRoutes } from './mailbox.routes';
import { notificationRoutes } from './notifications.routes';
import { certificationRoutes } from './certifications.routes';
import { equipmentRoutes } from './equipment.routes';
import { dashboardRoutes } from './dashboard.routes';
import { reportRoutes } from './reports.routes';
import { listExportRoutes } from './list-exports.routes';
import { techniqueRoutes } from './techniques.routes';
import { policyRoutes } from './policy.routes';
import { materialRoutes } from './materials.routes';
import { auditRoutes } from './audits.routes';
import { findingRoutes } from './findings.routes';
import { actionRoutes } from './actions.routes';
import { homeRoutes } from './home.routes';
import { inspectionRoutes } from './inspections.routes';
import { impactRoutes } from './impact.routes';
import { podDemonstrationRoutes } from './pod-demonstrations.routes';

export type RouteFactory = (deps: AppDeps) => Router;

export const featureRoutes: RouteFactory[] = [userRoutes, areaRoutes, trailRoutes, organisationRoutes, evidenceRoutes, mailboxRoutes, notificationRoutes, certificationRoutes, equipmentRoutes, dashboardRoutes, reportRoutes, listExportRoutes, techniqueRoutes, policyRoutes, materialRoutes, auditRoutes, findingRoutes, actionRoutes, homeRoutes, inspectionRoutes, impactRoutes, podDemonstrationRoutes];
