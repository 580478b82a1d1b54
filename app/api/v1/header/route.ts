import { api } from "@/lib/http/route";
import { headerInfo } from "@/lib/ops/header";

// The visitor's name and labs for the site header (anonymous: nobody); read after the page loads.
export const GET = api(({ caller }) => headerInfo(caller));
