import type { RequestHandler } from 'express';
import type { ProjectClient, ProjectClientInput } from '../../shared/api/api-schemas';
import { checkedName } from '../api/checked-text';
import { optionalText } from '../reports/profile-handlers';
import { ownProject } from './project-handlers';
import { projectClientView } from './project-revisions';

/*
 * Who a project's proposal goes to and the site it is for. The contract checks the e-mail's and
 * the phone's form; names and the address keep the shared rule for typed text.
 */

function checkedClient(body: ProjectClientInput): ProjectClient {
  const phone = body.clientPhone?.trim() ?? '';
  const site = optionalText(body.siteAddress ?? '', '/body/siteAddress');
  return {
    clientName: checkedName(body.clientName, '/body/clientName'),
    clientEmail: body.clientEmail.trim(),
    clientPhone: phone === '' ? null : phone,
    siteAddress: site === '' ? null : site,
  };
}

export function createProjectClientHandlers(): Record<'updateProjectClient', RequestHandler> {
  return {
    updateProjectClient: async (request, response) => {
      const client = checkedClient(request.body as ProjectClientInput);
      const project = await ownProject(request);
      await project.update(client);
      response.json(projectClientView(project));
    },
  };
}
