import type { Transaction } from 'sequelize';
import type { Container, CreateContainerInput, UpdateContainerInput } from '../../shared/schemas/container';
import { AppError } from '../errors';
import { ContainerModel } from '../models';

/** API shape of a saved pot or container. */
export function toContainer(c: ContainerModel): Container {
  return {
    id: c.id,
    profileId: c.profileId,
    name: c.name,
    kind: c.kind,
    tareGrams: c.tareGrams,
    createdAt: c.createdAt.toISOString(),
  };
}

/** A profile's pots and containers, pots first (enum order), then by name. */
export async function listContainers(profileId: number): Promise<Container[]> {
  const rows = await ContainerModel.findAll({ where: { profileId }, order: [['kind', 'ASC'], ['name', 'ASC'], ['id', 'ASC']] });
  return rows.map(toContainer);
}

/** Saves a new pot or container on the profile. */
export async function createContainer(profileId: number, input: CreateContainerInput): Promise<Container> {
  const row = await ContainerModel.create({
    profileId,
    name: input.name,
    kind: input.kind ?? 'container',
    tareGrams: Number(input.tareGrams),
  });
  return toContainer(row);
}

/** One container of this profile, or 404 (also for another profile's container). */
export async function findContainer(profileId: number, id: number, transaction?: Transaction): Promise<ContainerModel> {
  const row = await ContainerModel.findOne({ where: { id, profileId }, transaction });
  if (!row) throw AppError.notFound('container');
  return row;
}

/** Renames a container or corrects its tare; batches already weighed keep the tare they used. */
export async function updateContainer(profileId: number, id: number, input: UpdateContainerInput): Promise<Container> {
  const row = await findContainer(profileId, id);
  if (input.name !== undefined) row.name = input.name;
  if (input.kind !== undefined) row.kind = input.kind;
  if (input.tareGrams !== undefined) row.tareGrams = Number(input.tareGrams);
  await row.save();
  return toContainer(row);
}

/** Deletes a container; portions and batches keep its name and tare in their own records. */
export async function deleteContainer(profileId: number, id: number): Promise<void> {
  const row = await findContainer(profileId, id);
  await row.destroy();
}
