import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { createOrganisationSchema, type CreateOrganisationInput } from "../../../shared/auth/schemas.ts";
import { ORGANISATION_KINDS, ORGANISATION_KIND_LABELS } from "../../../shared/auth/roles.ts";
import { api } from "../../lib/api-client.ts";
import type { OrganisationView as OrganisationRow } from "../../../shared/auth/views.ts";
import type { ChainVerification } from "../../../shared/trail/views.ts";
import { applyServerErrors } from "../../lib/form-errors.ts";
import { useSignedIn } from "../../lib/signed-in.tsx";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { EmptyState, ErrorState, Notice, QueryStatus } from "../../components/ui/states.tsx";
import { SelectField, TextField } from "../../components/ui/field.tsx";
import { Button } from "../../components/ui/button.tsx";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

const organisationsQuery = {
  queryKey: ["platform", "organisations"],
  queryFn: () => api<OrganisationRow[]>("/api/platform/organisations"),
};

export function OrganisationsPage() {
  const { user } = useSignedIn();
  if (!user.isPlatformAdmin) return <EmptyState title="Only a platform admin manages organisations." />;
  return (
    <>
      <PageHeader title="Organisations" lead="Retailers, producers and laboratories on this Cellarpact platform." />
      <div className="flex flex-col gap-6">
        <OrganisationList />
        <CreateOrganisation />
        <ChainCheck />
      </div>
    </>
  );
}

function OrganisationList() {
  const orgs = useQuery(organisationsQuery);
  return (
    <Card title="All organisations">
      <QueryStatus query={orgs} empty="No organisations yet." />
      {orgs.data && orgs.data.length > 0 && (
        <DataTable headings={["Name", "Kind", "Country", "Members"]}>
          {orgs.data.map((o) => (
            <Row key={o.id}>
              <Cell className="font-semibold">{o.name}</Cell>
              <Cell>{ORGANISATION_KIND_LABELS[o.kind]}</Cell>
              <Cell>{o.country}</Cell>
              <Cell className="tabular-nums">{o.memberCount}</Cell>
            </Row>
          ))}
        </DataTable>
      )}
    </Card>
  );
}

function CreateOrganisation() {
  const qc = useQueryClient();
  const [msg, setMsg] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const create = useMutation({
    mutationFn: (v: CreateOrganisationInput) => api<OrganisationRow>("/api/platform/organisations", { method: "POST", body: v }),
  });
  const { register, handleSubmit, setError, reset, formState } = useForm<CreateOrganisationInput>({
    resolver: zodResolver(createOrganisationSchema),
    defaultValues: { name: "", kind: "producer", country: "", adminEmail: "" },
  });
  const onSubmit = handleSubmit((v) =>
    create.mutate(v, {
      onSuccess: (org) => {
        setMsg({ tone: "success", text: `${org.name} is open; its admin has been invited by e-mail.` });
        reset();
        void qc.invalidateQueries({ queryKey: organisationsQuery.queryKey });
      },
      onError: (err) => {
        const rest = applyServerErrors(err, setError, ["name", "kind", "country", "adminEmail"]);
        if (rest) setMsg({ tone: "error", text: rest });
      },
    }),
  );
  return (
    <Card title="Open an organisation">
      <form onSubmit={onSubmit} noValidate className="grid gap-4 md:grid-cols-2">
        {msg && (
          <div className="md:col-span-2">
            <Notice tone={msg.tone}>{msg.text}</Notice>
          </div>
        )}
        <TextField label="Name" error={formState.errors.name?.message} {...register("name")} />
        <SelectField
          label="Kind"
          options={ORGANISATION_KINDS.map((k) => ({ value: k, label: ORGANISATION_KIND_LABELS[k] }))}
          error={formState.errors.kind?.message}
          {...register("kind")}
        />
        <TextField
          label="Country"
          hint="Two letters, e.g. FR"
          maxLength={2}
          error={formState.errors.country?.message}
          {...register("country")}
        />
        <TextField label="First admin's e-mail" type="email" error={formState.errors.adminEmail?.message} {...register("adminEmail")} />
        <div className="md:col-span-2">
          <Button type="submit" disabled={create.isPending}>
            Open the organisation
          </Button>
        </div>
      </form>
    </Card>
  );
}

function ChainCheck() {
  const verify = useMutation({ mutationFn: () => api<ChainVerification>("/api/platform/trail/verify") });
  return (
    <Card title="The trail's hash chain">
      <p className="mb-4 text-sm text-ink-700">
        Recomputes every entry's SHA-256 hash and its link to the previous one, and compares the end of the chain with the checkpoint.
      </p>
      {verify.data?.ok && <Notice tone="success">The chain is intact: {verify.data.checked} entries checked.</Notice>}
      {verify.data && !verify.data.ok && (
        <Notice tone="error">
          The chain is broken at entry {verify.data.firstBroken?.seq}: {verify.data.firstBroken?.reason}.
        </Notice>
      )}
      {verify.isError && <ErrorState error={verify.error} />}
      <Button className="mt-4" variant="secondary" disabled={verify.isPending} onClick={() => verify.mutate()}>
        {verify.isPending ? "Verifying…" : "Verify the chain"}
      </Button>
    </Card>
  );
}
