import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';

export type MailStatus = 'pending' | 'sent' | 'failed';

/** One e-mail to send: written with the action that causes it, sent after commit by the mail sender. */
export class MailOutboxModel extends Model<InferAttributes<MailOutboxModel>, InferCreationAttributes<MailOutboxModel>> {
  declare id: CreationOptional<number>;
  declare kind: string;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string | null;
  declare htmlBody: string | null;
  declare status: CreationOptional<MailStatus>;
  declare attempts: CreationOptional<number>;
  declare nextAttemptAt: Date;
  declare lockedUntil: CreationOptional<Date | null>;
  declare lastError: CreationOptional<string | null>;
  declare sentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    MailOutboxModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        kind: { type: DataTypes.STRING(40), allowNull: false },
        toAddress: { type: DataTypes.STRING(254), allowNull: false },
        subject: { type: DataTypes.STRING(200), allowNull: false },
        textBody: { type: DataTypes.TEXT, allowNull: true },
        htmlBody: { type: DataTypes.TEXT, allowNull: true },
        status: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        nextAttemptAt: { type: DataTypes.DATE, allowNull: false },
        lockedUntil: { type: DataTypes.DATE, allowNull: true },
        lastError: { type: DataTypes.TEXT, allowNull: true },
        sentAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'mail_outbox', underscored: true },
    );
  }
}

/** A message the local fake SMTP server received (development and tests; never with a real SMTP host). */
export class CapturedMailModel extends Model<InferAttributes<CapturedMailModel>, InferCreationAttributes<CapturedMailModel>> {
  declare id: CreationOptional<number>;
  declare mailFrom: string;
  declare mailTo: string;
  declare subject: string;
  declare textBody: string | null;
  declare htmlBody: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    CapturedMailModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        mailFrom: { type: DataTypes.STRING(254), allowNull: false },
        mailTo: { type: DataTypes.STRING(1000), allowNull: false },
        subject: { type: DataTypes.STRING(200), allowNull: false },
        textBody: { type: DataTypes.TEXT, allowNull: true },
        htmlBody: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'captured_mails', underscored: true, updatedAt: false },
    );
  }
}
