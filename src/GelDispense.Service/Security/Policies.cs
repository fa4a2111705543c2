using Microsoft.AspNetCore.Authorization;

namespace GelDispense.Service.Security;

/// <summary>The authorization policies every route names, and which roles each admits.</summary>
public static class Policies
{
    /// <summary>Issue, list and revoke keys.</summary>
    public const string ManageKeys = "keys.manage";

    /// <summary>Add reagents and lots to the catalog.</summary>
    public const string WriteCatalog = "catalog.write";

    /// <summary>Evaluate compositions and compute plans.</summary>
    public const string Design = "design";

    /// <summary>Start batches, record additions, complete and abort; a station key only for its own station.</summary>
    public const string RunBatches = "batches.run";

    /// <summary>
    /// Correct a recorded addition's reading (a new audit event, never an edit): a station key only for its own
    /// station's batches, and admins; not lims (reads the record) nor formulators (design only).
    /// </summary>
    public const string CorrectAdditions = "additions.correct";

    /// <summary>Read the catalog, batches, as-made records, the CSV export and the live event stream.</summary>
    public const string Read = "read";

    /// <summary>Verify a batch's audit trail: for auditors (lims) and admins, not for those whose writes it checks.</summary>
    public const string ReadAudit = "audit.read";

    public static void Add(AuthorizationOptions options)
    {
        options.AddPolicy(ManageKeys, p => p.RequireRole(Roles.Admin));
        options.AddPolicy(WriteCatalog, p => p.RequireRole(Roles.Admin));
        options.AddPolicy(Design, p => p.RequireRole(Roles.Admin, Roles.Formulator));
        options.AddPolicy(RunBatches, p => p.RequireRole(Roles.Admin, Roles.Station));
        options.AddPolicy(CorrectAdditions, p => p.RequireRole(Roles.Admin, Roles.Station));
        options.AddPolicy(Read, p => p.RequireRole(Roles.All));
        options.AddPolicy(ReadAudit, p => p.RequireRole(Roles.Admin, Roles.Lims));

        // A route that names no policy still needs a caller; only routes marked AllowAnonymous (health, ping) skip it.
        options.FallbackPolicy = new AuthorizationPolicyBuilder().RequireAuthenticatedUser().Build();
    }
}
