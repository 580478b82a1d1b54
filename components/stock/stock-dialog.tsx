"use client";

export { Dialog as StockDialog } from "@/components/ui/dialog";
