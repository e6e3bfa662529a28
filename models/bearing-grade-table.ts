import { Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import type { Sequelize } from "sequelize";
import type { JsonObject } from "@/lib/schemas/json";
import { intId, json, modelOptions, ref, stamps, str } from "./columns";

/** A factory grade table a shop keeps (housing code × journal code → shell grade), in our documented JSON. */
export class BearingGradeTable extends Model<
  InferAttributes<BearingGradeTable>,
  InferCreationAttributes<BearingGradeTable>
> {
  declare id: CreationOptional<number>;
  declare shopId: number;
  declare name: string;
  declare document: JsonObject;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initBearingGradeTable(sequelize: Sequelize): void {
  BearingGradeTable.init(
    {
      id: intId(),
      shopId: ref(),
      name: str(120),
      document: json(false),
      ...stamps(),
    },
    modelOptions(sequelize, "bearing_grade_tables", "both"),
  );
}
