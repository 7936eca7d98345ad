import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';

/** One time of day of a day kind: [startMinute, endMinute), ratio in g/unit, correction factor in mmol/L per unit. */
export class TimeOfDayModel extends Model<InferAttributes<TimeOfDayModel>, InferCreationAttributes<TimeOfDayModel>> {
  declare id: CreationOptional<number>;
  declare dayKindId: number;
  declare startMinute: number;
  declare endMinute: number;
  declare carbRatio: number;
  declare correctionFactorMmol: number;

  static initModel(sequelize: Sequelize) {
    TimeOfDayModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        dayKindId: { type: DataTypes.INTEGER, allowNull: false },
        startMinute: { type: DataTypes.INTEGER, allowNull: false },
        endMinute: { type: DataTypes.INTEGER, allowNull: false },
        carbRatio: { type: DataTypes.DOUBLE, allowNull: false },
        correctionFactorMmol: { type: DataTypes.DOUBLE, allowNull: false },
      },
      { sequelize, tableName: 'times_of_day', underscored: true, timestamps: false },
    );
  }
}
