"use client";

import { CheckUnavailable } from "@/components/shell/outage";
import { Button } from "@/components/ui/button";
import { Caution } from "@/components/ui/caution";

// Whatever went wrong, a check that did not complete says nothing about the printout.
export default function CheckError({ reset }: { error: Error; reset: () => void }) {
  return (
    <div className="mx-auto max-w-xl">
      <CheckUnavailable />
      <div className="mt-4">
        <Button onClick={() => reset()}>Check again</Button>
      </div>
      <Caution className="mt-8" />
    </div>
  );
}
