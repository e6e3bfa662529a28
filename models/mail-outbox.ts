import {
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import { datetime, int, intId, json, modelOptions, ref, stamps, str, text } from "./columns";
import type { JsonObject } from "@/lib/schemas/json";

/** A message waiting to be sent (sentAt null) or sent. Failures set lastError and nextAttemptAt. */
export class MailOutbox extends Model<InferAttributes<MailOutbox>, InferCreationAttributes<MailOutbox>> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  /** 'build_record', 'flag_digest' or 'ready_for_release'. */
  declare kind: string;
  /** When set, unique: the same event queues its message once, whichever instance sees it. */
  declare dedupeKey: CreationOptional<string | null>;
  declare toAddress: string;
  declare subject: string;
  declare payload: JsonObject;
  declare attempts: CreationOptional<number>;
  declare lastError: CreationOptional<string | null>;
  declare nextAttemptAt: CreationOptional<Date>;
  declare sentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initMailOutbox(sequelize: Sequelize): void {
  MailOutbox.init(
    {
      id: intId(),
      shopId: ref(),
      kind: str(32),
      dedupeKey: str(128, true),
      toAddress: str(255),
      subject: str(255),
      payload: json(false),
      attempts: int(0),
      lastError: text(),
      nextAttemptAt: datetime(false, true),
      sentAt: datetime(true),
      ...stamps(),
    },
    modelOptions(sequelize, "mail_outbox", "both"),
  );
}
