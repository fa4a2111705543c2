namespace GelDispense.Service.Security;

/// <summary>
/// What a caller may do. Admin manages keys and the reagent catalog; formulator designs (compositions, plans);
/// station starts and records batches for its own station; lims reads. Admin may also do everything the others may,
/// so one key can run a small site.
/// </summary>
public static class Roles
{
    public const string Admin = "admin";
    public const string Formulator = "formulator";
    public const string Station = "station";
    public const string Lims = "lims";

    public static readonly string[] All = [Admin, Formulator, Station, Lims];
}
