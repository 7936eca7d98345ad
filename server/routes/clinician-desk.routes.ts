import { clinicianDeskSchema, peopleOfferResultSchema } from '../../shared/schemas/clinician-desk';
import { idParamSchema } from '../../shared/schemas/common';
import { clinicianDesk } from '../services/clinician-desk.service';
import { offerRecipeToMyPeople } from '../services/recipe-sharing.service';
import { access, defineRoute, type AnyRoute } from './registry';

/** The clinician's desk: the people the signed-in account supports as clinician, and a recipe offered to all of them. */
export function clinicianDeskRoutes(): AnyRoute[] {
  return [
    defineRoute({
      method: 'get', path: '/clinician-desk', access: access.signedIn, response: clinicianDeskSchema,
      summary:
        'The people whose profiles you hold as clinician (name, colour, last meal, time in range and ratio-review flags over the last 14 local days, by the logbook\'s own rules) and the invitations waiting for your address. Empty for anyone who supports nobody.',
      handler: async ({ user }, _req, res) => res.json(await clinicianDesk(user.id)),
    }),
    defineRoute({
      method: 'post', path: '/recipes/:id/offers-to-my-people', access: access.signedIn, params: idParamSchema, status: 202, response: peopleOfferResultSchema,
      summary:
        'Offer a recipe you own to the owner of every profile you hold as clinician (each accepts or declines, as with `/shares`); every offer counts toward the 20 an hour (429, none sent). 422 when you support nobody.',
      handler: async ({ params, user }, _req, res) => res.status(202).json({ status: 'offered', people: await offerRecipeToMyPeople(params.id, user.id) }),
    }),
  ];
}
