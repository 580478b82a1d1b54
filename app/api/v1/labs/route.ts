import { api } from "@/lib/http/route";
import { createLab } from "@/lib/ops/lab-create";

export const POST = api(async ({ caller, body }) => createLab(caller, await body()), { status: 201 });
