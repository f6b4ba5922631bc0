import type { RouteSpec } from '../http/registry';
import { accountRoutes } from './account';
import { adminRoutes } from './admin';
import { buildRoutes } from './builds';
import { episodeEditorRoutes } from './episode-editor';
import { figureRoutes } from './figures';
import { mediaRoutes } from './media';
import { followingRoutes } from './following';
import { postRoutes } from './posts';
import { openItemRoutes } from './open-items';
import { partLineRoutes } from './part-lines';
import { readingRoutes } from './reading';
import { workbenchRoutes } from './workbench';
import { episodeRoutes } from './episodes';
import { healthRoutes } from './health';
import { invitationRoutes } from './invitations';
import { sessionRoutes } from './session';
import { sponsorAdminRoutes, sponsorSummaryRoutes } from './sponsors';
import { sponsorshipRoutes } from './sponsorships';

/** The route registry: every API route, in one list that the authorisation matrix and fuzzers read. */
export const routeRegistry: readonly RouteSpec[] = [
  ...healthRoutes,
  ...episodeRoutes,
  ...sessionRoutes,
  ...accountRoutes,
  ...invitationRoutes,
  ...adminRoutes,
  ...buildRoutes,
  ...episodeEditorRoutes,
  ...openItemRoutes,
  ...figureRoutes,
  ...workbenchRoutes,
  ...readingRoutes,
  ...partLineRoutes,
  ...mediaRoutes,
  ...postRoutes,
  ...followingRoutes,
  ...sponsorAdminRoutes,
  ...sponsorSummaryRoutes,
  ...sponsorshipRoutes,
];
