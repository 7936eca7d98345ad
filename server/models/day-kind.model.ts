import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import type { TimeOfDayModel } from './time-of-day.model';

/** A named kind of day on a profile ("Rest", "Long ride"), holding its times of day. */
export class DayKindModel extends Model<InferAttributes<DayKindModel>, InferCreationAttributes<DayKindModel>> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare name: string;
  declare isDefault: boolean;
  declare longActingUnits: number | null;
  declare timesOfDay?: NonAttribute<TimeOfDayModel[]>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    DayKindModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(40), allowNull: false },
        isDefault: { type: DataTypes.BOOLEAN, allowNull: false },
        longActingUnits: { type: DataTypes.DOUBLE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'day_kinds', underscored: true },
    );
  }
}
