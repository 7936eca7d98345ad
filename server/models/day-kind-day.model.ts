import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';

/** One date of a profile given a day kind other than the default ("YYYY-MM-DD", the person's local date). */
export class DayKindDayModel extends Model<InferAttributes<DayKindDayModel>, InferCreationAttributes<DayKindDayModel>> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare date: string;
  declare dayKindId: number;
  declare setByUserId: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    DayKindDayModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        date: { type: DataTypes.DATEONLY, allowNull: false },
        dayKindId: { type: DataTypes.INTEGER, allowNull: false },
        setByUserId: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'day_kind_days', underscored: true },
    );
  }
}
