namespace Monitor.Cli.Load;

/// <summary>What <c>monitor load</c> drives: the service in-process, a bare consumer that does nothing, or both one after the other.</summary>
internal enum LoadMode
{
    Service,
    Bare,
    Both,
}
