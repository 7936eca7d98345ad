import { Op } from 'sequelize';
import type { CreateFoodSynonymInput, FoodSynonym } from '../../shared/schemas/food-synonym';
import { AppError } from '../errors';
import { FoodSynonymModel } from '../models';
import { normaliseSearchText } from '../search/search-text';
import { refreshFoodWords } from './imports.service';

function toFoodSynonym(row: FoodSynonymModel): FoodSynonym {
  return { id: row.id, term: row.term, equivalent: row.equivalent, origin: row.origin, reference: row.reference, createdAt: row.createdAt.toISOString() };
}

/** Every synonym pair, alphabetically by term. */
export async function listFoodSynonyms(): Promise<FoodSynonym[]> {
  const rows = await FoodSynonymModel.findAll({ order: [['term', 'ASC'], ['equivalent', 'ASC']] });
  return rows.map(toFoodSynonym);
}

/** Adds a pair (stored normalised, as search compares); the same pair in either direction is a conflict. */
export async function createFoodSynonym(input: CreateFoodSynonymInput, userId: number): Promise<FoodSynonym> {
  const term = normaliseSearchText(input.term);
  const equivalent = normaliseSearchText(input.equivalent);
  if (term === equivalent) throw AppError.validation({ equivalent: ['Give a different name.'] });
  const existing = await FoodSynonymModel.findOne({
    where: { [Op.or]: [{ term, equivalent }, { term: equivalent, equivalent: term }] },
  });
  if (existing) throw AppError.conflict('These two names are already in the synonym table.', { term: ['Already listed.'] });
  const row = await FoodSynonymModel.create({ term, equivalent, origin: input.origin, reference: input.reference, createdByUserId: userId });
  await refreshFoodWords(FoodSynonymModel.sequelize!);
  return toFoodSynonym(row);
}

/** Removes a pair, or 404. */
export async function deleteFoodSynonym(id: number): Promise<void> {
  const removed = await FoodSynonymModel.destroy({ where: { id } });
  if (!removed) throw AppError.notFound('synonym');
  await refreshFoodWords(FoodSynonymModel.sequelize!);
}
