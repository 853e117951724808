"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { requiredText, text } from "@/lib/schemas/fields";
import { SYSTEM_KIND_LABELS, systemKindSchema } from "@/lib/schemas/project-record";
import { fetchJson, RequestError } from "@/lib/fetch-json";

const newProjectFormSchema = z.object({
  name: requiredText(200),
  client: text(200),
  systemKind: systemKindSchema,
  jurisdictionId: z.string().min(1, { message: "choose a jurisdiction" }),
  address: text(300),
  templateId: z.string(),
});
type NewProjectValues = z.infer<typeof newProjectFormSchema>;

export interface JurisdictionOption {
  id: string;
  name: string;
  necEdition: string;
}

const KINDS = [
  { value: "stand-alone", label: "Stand-alone", note: "PV and batteries, no other source" },
  { value: "stand-alone-generator", label: "Stand-alone with generator", note: "a generator backs up the batteries" },
  { value: "hybrid", label: "Hybrid / grid-interactive", note: "a hybrid inverter works with the utility" },
] as const;

export interface TemplateOption {
  id: string;
  name: string;
  description: string;
  systemKind: string;
}

export function NewProjectForm({ jurisdictions, templates }: { jurisdictions: JurisdictionOption[]; templates: TemplateOption[] }) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<NewProjectValues>({
    resolver: zodResolver(newProjectFormSchema),
    defaultValues: { name: "", client: "", address: "", systemKind: "stand-alone", templateId: "", jurisdictionId: jurisdictions.length === 1 ? jurisdictions[0]!.id : "" },
  });
  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const { id } = await fetchJson<{ id: string }>("/api/projects", {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ ...values, templateId: values.templateId || undefined }),
      });
      router.push(`/projects/${id}`);
    } catch (error) {
      if (error instanceof RequestError) {
        for (const issue of error.issues) setError(issue.path as keyof NewProjectValues, { message: issue.message });
        setFailure(error.message);
      } else setFailure("The project was not created. Try again.");
    }
  });
  const templateId = watch("templateId");
  const template = templates.find((t) => t.id === templateId);
  const err = (name: keyof NewProjectValues) =>
    errors[name]?.message ? (
      <span id={`${name}-error`} role="alert" className="mt-1 block text-xs font-medium text-signal">
        {errors[name]?.message}
      </span>
    ) : null;
  return (
    <form noValidate onSubmit={onSubmit} className="sheet max-w-2xl space-y-4 px-5 py-5" aria-label="New project">
      {failure ? (
        <p role="alert" className="border-l-4 border-l-signal bg-signal-soft/40 px-3 py-2 text-sm">
          {failure}
        </p>
      ) : null}
      <div>
        <label htmlFor="name" className="field-label mb-1 block">
          Project name
        </label>
        <input id="name" className="input" aria-invalid={errors.name ? true : undefined} aria-describedby="name-error" {...register("name")} />
        {err("name")}
      </div>
      <div>
        <label htmlFor="client" className="field-label mb-1 block">
          Client
        </label>
        <input id="client" className="input" {...register("client")} />
        {err("client")}
      </div>
      <div>
        <label htmlFor="address" className="field-label mb-1 block">
          Site address
        </label>
        <input id="address" className="input" {...register("address")} />
        {err("address")}
      </div>
      <div>
        <label htmlFor="templateId" className="field-label mb-1 block">
          Start from
        </label>
        <select
          id="templateId"
          className="input"
          aria-describedby="template-help templateId-error"
          {...register("templateId", {
            onChange: (event: React.ChangeEvent<HTMLSelectElement>) => {
              const chosen = templates.find((t) => t.id === event.target.value);
              if (chosen) setValue("systemKind", chosen.systemKind as NewProjectValues["systemKind"]);
            },
          })}
        >
          <option value="">a blank design</option>
          {templates.map((t) => (
            <option key={t.id} value={t.id}>
              template: {t.name}
            </option>
          ))}
        </select>
        <p id="template-help" className="mt-1 text-xs text-ink-faint">
          {template
            ? `${SYSTEM_KIND_LABELS[template.systemKind as keyof typeof SYSTEM_KIND_LABELS] ?? template.systemKind}. ${template.description} The equipment, arrays and circuits are copied in; enter the site and change what differs.`
            : "A template brings the equipment, arrays and circuits of one of the firm's standard kits."}
        </p>
        {err("templateId")}
      </div>
      <fieldset hidden={Boolean(template)}>
        <legend className="field-label mb-1">System kind</legend>
        <div className="grid gap-2 sm:grid-cols-3">
          {KINDS.map((k) => (
            <label key={k.value} className="flex cursor-pointer items-start gap-2 border border-rule bg-white px-3 py-2 text-sm has-[:checked]:border-slate has-[:checked]:bg-slate-soft/50">
              <input type="radio" value={k.value} className="mt-1 accent-slate" {...register("systemKind")} />
              <span>
                <span className="block font-medium">{k.label}</span>
                <span className="block text-xs text-ink-soft">{k.note}</span>
              </span>
            </label>
          ))}
        </div>
        {err("systemKind")}
      </fieldset>
      <div>
        <label htmlFor="jurisdictionId" className="field-label mb-1 block">
          Jurisdiction
        </label>
        <select
          id="jurisdictionId"
          className="input"
          aria-invalid={errors.jurisdictionId ? true : undefined}
          aria-describedby="jurisdictionId-error jurisdiction-help"
          {...register("jurisdictionId")}
        >
          <option value="">— choose —</option>
          {jurisdictions.map((j) => (
            <option key={j.id} value={j.id}>
              {j.name} (NEC {j.necEdition})
            </option>
          ))}
        </select>
        <p id="jurisdiction-help" className="mt-1 text-xs text-ink-faint">
          The Authority Having Jurisdiction where the system will be built; its adopted NEC edition sets every code reference. The permit office keeps this list.
        </p>
        {err("jurisdictionId")}
      </div>
      <div className="flex gap-2 border-t border-rule pt-4">
        <button type="submit" className="btn" disabled={isSubmitting}>
          {isSubmitting ? "Creating…" : "Create project"}
        </button>
      </div>
    </form>
  );
}
